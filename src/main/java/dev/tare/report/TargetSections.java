package dev.tare.report;

import dev.tare.config.TargetConfig;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Footprint;
import dev.tare.scan.ScanResult;
import dev.tare.scan.ScannedTemplate;
import java.util.ArrayList;
import java.util.List;

/**
 * The per-target part of a scan's text report: for each priced target, cost per call and per month
 * of every template; for each target with a model, prefill, decode, KV cache and concurrency.
 */
final class TargetSections {
    private TargetSections() {
    }

    /** Every section, then the estimate note and what each target lacks; empty when no target estimates anything. */
    static String render(ScanResult result, ScanResult.Order order) {
        StringBuilder out = new StringBuilder();
        List<String> gaps = new ArrayList<>();
        List<ScannedTemplate> templates = result.templatesIn(order).stream().filter(ScannedTemplate::countsInTotals)
                .toList();
        for (TargetConfig target : result.targetConfigs()) {
            Coverage coverage = Coverage.of(target);
            if (coverage.hasCost()) {
                out.append('\n').append(cost(target, templates));
            }
            if (coverage.hasDeviceFigures()) {
                out.append('\n').append(device(target, templates));
            }
            if (coverage.hasCost() || coverage.hasDeviceFigures()) {
                gaps.addAll(Figures.missing(target, coverage));
            }
        }
        if (out.length() == 0) {
            return "";
        }
        out.append('\n').append(Figures.ESTIMATE_NOTE).append('\n');
        gaps.forEach(line -> out.append(line).append('\n'));
        return out.toString();
    }

    private static String cost(TargetConfig target, List<ScannedTemplate> templates) {
        TextTable table = new TextTable(List.of("PATH", "INPUT", "CACHED", "OUTPUT", "COST/CALL", "COST/MONTH"),
                false, true, true, true, true, true);
        for (ScannedTemplate template : templates) {
            Footprint f = template.targets().get(target.name());
            if (f != null) {
                table.row(List.of(template.path(), Figures.count(f.inputTokens()),
                        f.cachedInputTokens().isPresent() ? Figures.count(f.cachedInputTokens().getAsInt()) : "-",
                        Figures.count(f.outputTokens()), Figures.perCall(f), Figures.perMonth(f)));
            }
        }
        StringBuilder head = new StringBuilder("Cost on ").append(target.name()).append(" (")
                .append(Figures.price(target.price().orElseThrow()));
        target.callsPerDay().ifPresent(calls -> head.append("; ").append(Figures.significant(calls)).append(" calls a day"));
        target.prefixCacheMinTokens().ifPresent(min -> head.append("; prefixes of ").append(Figures.count(min))
                .append("+ tokens shared with another template are cached"));
        return head.append(")").append(calibration(target)).append(":\n").append(table.render()).toString();
    }

    private static String device(TargetConfig target, List<ScannedTemplate> templates) {
        TextTable table = new TextTable(List.of("PATH", "INPUT", "OUTPUT", "PREFILL", "PREFILL MS", "DECODE MS/TOKEN",
                "KV CACHE", "MAX CONCURRENT"), false, true, true, true, true, true, true, true);
        for (ScannedTemplate template : templates) {
            Footprint f = template.targets().get(target.name());
            if (f != null) {
                table.row(List.of(template.path(), Figures.count(f.inputTokens()), Figures.count(f.outputTokens()),
                        f.prefillFlops().isPresent() ? Figures.flops(f.prefillFlops().getAsDouble()) : "-",
                        f.prefillMillis().isPresent() ? Figures.significant(f.prefillMillis().getAsDouble()) : "-",
                        f.decodeMillisPerToken().isPresent() ? Figures.significant(f.decodeMillisPerToken().getAsDouble()) : "-",
                        f.kvCacheBytes().isPresent() ? Figures.bytes(f.kvCacheBytes().getAsLong()) : "-",
                        f.maxConcurrent().isPresent() ? Figures.count(f.maxConcurrent().getAsLong()) : "-"));
            }
        }
        StringBuilder head = new StringBuilder("Device figures on ").append(target.name()).append(calibration(target))
                .append(":\n");
        head.append("  model   ").append(Figures.model(target.model().orElseThrow())).append('\n');
        head.append("  weights ").append(Figures.bits(target.weightBits()));
        templates.stream().map(t -> t.targets().get(target.name())).filter(f -> f != null && f.weightBytes().isPresent())
                .findFirst().ifPresent(f -> head.append(" = ").append(Figures.bytes(f.weightBytes().getAsLong())));
        head.append("; KV cache ").append(Figures.bits(target.kvBits()));
        templates.stream().map(t -> t.targets().get(target.name())).filter(f -> f != null && f.kvBytesPerToken().isPresent())
                .findFirst().ifPresent(f -> head.append(" = ").append(Figures.bytes(f.kvBytesPerToken().getAsLong()))
                        .append(" per token"));
        head.append('\n');
        target.device().ifPresent(d -> head.append("  device  ").append(Figures.device(d)).append('\n'));
        return head.append(table.render()).toString();
    }

    /** The mark of a calibrated target's figures. */
    static String calibration(TargetConfig target) {
        return target.isCalibrated() ? "; calibrated estimate: counts scaled by " + Figures.significant(target.scale()) : "";
    }
}
