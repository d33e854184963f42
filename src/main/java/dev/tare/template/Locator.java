package dev.tare.template;

/** Turns an offset in parsed text into a line and column of the file it came from. */
interface Locator {
    int line(int offset);

    int column(int offset);

    default Span span(int start, int end) {
        return new Span(start, end, line(start), column(start));
    }
}
