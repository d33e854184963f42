package dev.tare.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.DoubleFunction;

/**
 * A horizontal bar chart drawn as inline SVG: one labelled row per item, each bar made of one or
 * more stacked parts, a value written at the end of every bar, and a scale with gridlines. Parts
 * are told apart by fill patterns as well as by tone, so the chart reads in greyscale and on paper.
 */
final class SvgBarChart {
    /** How a series is filled: a solid tone, diagonal hatching or dots. */
    enum Fill { SOLID, HATCH, DOTS }

    /** One stacked series: its name for the legend and how it is filled. */
    record Series(String name, Fill fill) {
    }

    /**
     * One row.
     *
     * @param label      the row's label (shortened from the left when long; the full text is the tooltip)
     * @param values     one value per series, in series order; negative values draw as zero
     * @param valueLabel written after the bar
     * @param data       the row's {@code data-*} attributes, already escaped, with a leading space
     */
    record Row(String label, List<Double> values, String valueLabel, String data) {
    }

    private static final int WIDTH = 960;
    private static final int LABEL_WIDTH = 340;
    private static final int VALUE_WIDTH = 130;
    private static final int ROW_HEIGHT = 24;
    private static final int BAR_HEIGHT = 14;
    private static final int TOP = 30;
    private static final int MAX_LABEL_CHARS = 46;

    private final String id;
    private final String title;
    private final List<Series> series;
    private final DoubleFunction<String> tickLabel;
    private final List<Row> rows = new ArrayList<>();

    /**
     * @param id        unique within the page; prefixes the chart's pattern ids
     * @param title     what the chart shows, for screen readers and as its tooltip
     * @param series    the stacked series, bottom first
     * @param tickLabel how a value on the scale is written
     */
    SvgBarChart(String id, String title, List<Series> series, DoubleFunction<String> tickLabel) {
        this.id = id;
        this.title = title;
        this.series = List.copyOf(series);
        this.tickLabel = tickLabel;
    }

    void row(Row row) {
        rows.add(row);
    }

    String render() {
        double max = rows.stream().mapToDouble(r -> r.values().stream().mapToDouble(v -> Math.max(0, v)).sum())
                .max().orElse(0);
        double step = step(max);
        double scaleMax = Math.max(step, Math.ceil(max / step) * step);
        int barArea = WIDTH - LABEL_WIDTH - VALUE_WIDTH;
        int height = TOP + rows.size() * ROW_HEIGHT + 8;
        StringBuilder svg = new StringBuilder();
        svg.append("<svg class=\"chart\" data-chart=\"").append(Html.attr(id)).append("\" viewBox=\"0 0 ").append(WIDTH)
                .append(' ').append(height).append("\" width=\"").append(WIDTH).append("\" height=\"").append(height)
                .append("\" role=\"img\" aria-labelledby=\"").append(Html.attr(id)).append("-title\">\n");
        svg.append("<title id=\"").append(Html.attr(id)).append("-title\">").append(Html.text(title)).append("</title>\n");
        svg.append(defs());
        for (double tick = 0; tick <= scaleMax + step / 2; tick += step) {
            double x = LABEL_WIDTH + tick / scaleMax * barArea;
            svg.append("<line class=\"grid\" x1=\"").append(fmt(x)).append("\" y1=\"").append(TOP - 6).append("\" x2=\"")
                    .append(fmt(x)).append("\" y2=\"").append(height - 8).append("\"/>");
            svg.append("<text class=\"tick\" x=\"").append(fmt(x)).append("\" y=\"").append(TOP - 12)
                    .append("\" text-anchor=\"middle\">").append(Html.text(tickLabel.apply(tick))).append("</text>\n");
        }
        int y = TOP;
        for (Row row : rows) {
            svg.append("<g class=\"bar\"").append(row.data()).append(">");
            svg.append("<title>").append(Html.text(row.label() + ": " + row.valueLabel())).append("</title>");
            svg.append("<text class=\"label\" x=\"").append(LABEL_WIDTH - 10).append("\" y=\"").append(y + BAR_HEIGHT - 2)
                    .append("\" text-anchor=\"end\">").append(Html.text(shorten(row.label()))).append("</text>");
            double x = LABEL_WIDTH;
            for (int s = 0; s < series.size(); s++) {
                double width = Math.max(0, row.values().get(s)) / scaleMax * barArea;
                if (width > 0) {
                    svg.append("<rect class=\"part part-").append(s).append("\" x=\"").append(fmt(x)).append("\" y=\"")
                            .append(y + 1).append("\" width=\"").append(fmt(width)).append("\" height=\"").append(BAR_HEIGHT)
                            .append("\" fill=\"").append(fill(s)).append("\"/>");
                }
                x += width;
            }
            svg.append("<text class=\"value\" x=\"").append(fmt(x + 8)).append("\" y=\"").append(y + BAR_HEIGHT - 2)
                    .append("\">").append(Html.text(row.valueLabel())).append("</text>");
            svg.append("</g>\n");
            y += ROW_HEIGHT;
        }
        return svg.append("</svg>\n").toString();
    }

    /** The legend: one swatch per series, filled from the chart's own patterns (render the chart on the same page). */
    String legend() {
        StringBuilder out = new StringBuilder("<ul class=\"legend\">");
        for (int s = 0; s < series.size(); s++) {
            out.append("<li><svg class=\"swatch\" viewBox=\"0 0 28 14\" width=\"28\" height=\"14\" aria-hidden=\"true\">")
                    .append("<rect class=\"part part-").append(s).append("\" x=\"0.5\" y=\"0.5\" width=\"27\" height=\"13\"")
                    .append(" fill=\"").append(fill(s)).append("\"/></svg>").append(Html.text(series.get(s).name()))
                    .append("</li>");
        }
        return out.append("</ul>\n").toString();
    }

    private String defs() {
        StringBuilder out = new StringBuilder("<defs>");
        for (int s = 0; s < series.size(); s++) {
            String pattern = Html.attr(id) + "-p" + s;
            switch (series.get(s).fill()) {
                case HATCH -> out.append("<pattern id=\"").append(pattern).append("\" width=\"6\" height=\"6\"")
                        .append(" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(45)\">")
                        .append("<rect class=\"hatch-ground\" width=\"6\" height=\"6\"/>")
                        .append("<rect class=\"hatch-line\" width=\"3\" height=\"6\"/></pattern>");
                case DOTS -> out.append("<pattern id=\"").append(pattern).append("\" width=\"5\" height=\"5\"")
                        .append(" patternUnits=\"userSpaceOnUse\">")
                        .append("<rect class=\"dots-ground\" width=\"5\" height=\"5\"/>")
                        .append("<circle class=\"dots-dot\" cx=\"2.5\" cy=\"2.5\" r=\"1.3\"/></pattern>");
                case SOLID -> {
                }
            }
        }
        return out.append("</defs>").toString();
    }

    private String fill(int s) {
        return series.get(s).fill() == Fill.SOLID ? "currentColor" : "url(#" + Html.attr(id) + "-p" + s + ")";
    }

    private static String shorten(String label) {
        return label.length() <= MAX_LABEL_CHARS ? label : "…" + label.substring(label.length() - MAX_LABEL_CHARS + 1);
    }

    /** A round scale step giving at most five gridlines. */
    static double step(double max) {
        if (max <= 0) {
            return 1;
        }
        double raw = max / 5;
        double magnitude = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[] {1, 2, 2.5, 5, 10}) {
            if (m * magnitude >= raw) {
                return m * magnitude;
            }
        }
        return 10 * magnitude;
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.1f", v);
    }
}
