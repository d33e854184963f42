package dev.tare.scan;

import java.lang.reflect.RecordComponent;
import java.util.Collection;
import java.util.Map;
import java.util.Optional;

/**
 * Writes out a tree of records, collections, maps and plain values (a loaded configuration) as
 * text holding every component, for a cache key. A record's own {@code toString} says the same,
 * but its first call per record class builds the method handles behind it, about 30 ms at the
 * start of every scan; reading the components by reflection costs a few.
 */
final class ValueText {
    private ValueText() {
    }

    static String of(Object value) {
        StringBuilder out = new StringBuilder(512);
        append(out, value);
        return out.toString();
    }

    private static void append(StringBuilder out, Object value) {
        if (value instanceof Record record) {
            out.append(record.getClass().getName()).append('[');
            RecordComponent[] components = record.getClass().getRecordComponents();
            for (int i = 0; i < components.length; i++) {
                out.append(i == 0 ? "" : ", ").append(components[i].getName()).append('=');
                try {
                    var accessor = components[i].getAccessor();
                    accessor.setAccessible(true);
                    append(out, accessor.invoke(record));
                } catch (ReflectiveOperationException | RuntimeException e) {
                    // Not expected of a record; its own text still tells one configuration from another.
                    out.append(record);
                }
            }
            out.append(']');
        } else if (value instanceof Collection<?> items) {
            out.append('[');
            String separator = "";
            for (Object item : items) {
                out.append(separator);
                append(out, item);
                separator = ", ";
            }
            out.append(']');
        } else if (value instanceof Map<?, ?> map) {
            out.append('{');
            String separator = "";
            for (Map.Entry<?, ?> entry : map.entrySet()) {
                out.append(separator);
                append(out, entry.getKey());
                out.append('=');
                append(out, entry.getValue());
                separator = ", ";
            }
            out.append('}');
        } else if (value instanceof Optional<?> optional) {
            if (optional.isPresent()) {
                out.append("Optional[");
                append(out, optional.get());
                out.append(']');
            } else {
                out.append("Optional.empty");
            }
        } else {
            out.append(value);
        }
    }
}
