package dev.tare.template;

/** Finds the template an include names. */
public interface IncludeResolver {

    /**
     * The template {@code include} in {@code from} refers to.
     *
     * @throws dev.tare.TareException naming the line when it is missing, unreadable or outside the root
     */
    Template resolve(Segment.Include include, Template from);

    /** A resolver for templates that may not include anything. */
    IncludeResolver NONE = (include, from) -> {
        throw new dev.tare.TareException("line " + include.span().line() + ": include '" + include.name()
                + "' cannot be resolved here");
    };
}
