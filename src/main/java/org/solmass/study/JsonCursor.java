package org.solmass.study;

import com.fasterxml.jackson.databind.JsonNode;
import org.solmass.InputException;
import org.solmass.TextInput;

import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;

/**
 * Reads one JSON object of a study strictly: typed getters with defaults and ranges, every error an
 * {@link InputException} naming the full key path; {@link #finish()} rejects keys nobody asked for.
 */
final class JsonCursor {
    private final JsonNode node;
    private final String path;
    private final Function<String, String> where;
    private final Set<String> seen = new LinkedHashSet<>();

    /**
     * @param node the object
     * @param path its key path ("" for the root, "site", "outputs", ...)
     * @param where maps a key path to the "where" of an error (file plus key, or the flag it came from)
     */
    JsonCursor(JsonNode node, String path, Function<String, String> where) {
        this.node = node;
        this.path = path;
        this.where = where;
    }

    String keyPath(String key) { return path.isEmpty() ? key : path + "." + key; }

    InputException error(String key, String message) {
        return new InputException(where.apply(keyPath(key)), message);
    }

    /** The raw node of a key, or null when absent (JSON null counts as absent). */
    JsonNode raw(String key) {
        seen.add(key);
        JsonNode n = node.get(key);
        return n == null || n.isNull() ? null : n;
    }

    boolean has(String key) {
        JsonNode n = node.get(key);
        return n != null && !n.isNull();
    }

    /** A cursor over a node standing for {@code key} of this object. */
    JsonCursor child(String key, JsonNode n) { return new JsonCursor(n, keyPath(key), where); }

    /** A nested object; an absent key gives an empty object. */
    JsonCursor object(String key) {
        JsonNode n = raw(key);
        if (n == null) n = com.fasterxml.jackson.databind.node.JsonNodeFactory.instance.objectNode();
        if (!n.isObject()) throw error(key, "expected an object { ... }, got " + shown(n));
        return new JsonCursor(n, keyPath(key), where);
    }

    String string(String key, String dflt) {
        JsonNode n = raw(key);
        if (n == null) {
            if (dflt == null) throw error(key, "missing; a text value is required");
            return dflt;
        }
        if (!n.isTextual()) throw error(key, "expected a text value in quotes, got " + shown(n));
        String s = n.asText().trim();
        if (s.isEmpty()) throw error(key, "expected a non-empty text value, got \"\"");
        return s;
    }

    /**
     * The value {@code text} of {@code key} as a path resolved against {@code base}; a text that cannot
     * be a path (a NUL character) is an error naming the key.
     */
    Path path(String key, String text, Path base) {
        try {
            return base.resolve(text).normalize();
        } catch (InvalidPathException e) {
            throw error(key, TextInput.invalidPath(text, e));
        }
    }

    /** Optional text, may be empty; absent gives {@code dflt}. */
    String text(String key, String dflt) {
        JsonNode n = raw(key);
        if (n == null) return dflt;
        if (!n.isTextual()) throw error(key, "expected a text value in quotes, got " + shown(n));
        return n.asText();
    }

    /** A number in [min, max]; {@code dflt} null means required. */
    double number(String key, Double dflt, double min, double max) {
        JsonNode n = raw(key);
        String expected = "expected a number from " + fmt(min) + " to " + fmt(max);
        if (n == null) {
            if (dflt == null) throw error(key, "missing; " + expected);
            return dflt;
        }
        if (!n.isNumber()) throw error(key, expected + ", got " + shown(n));
        double v = n.asDouble();
        if (!(v >= min && v <= max)) throw error(key, expected + ", got " + shown(n));
        return v;
    }

    /** A number greater than {@code lowExclusive} and at most max. */
    double positive(String key, double dflt, double lowExclusive, double max) {
        JsonNode n = raw(key);
        String expected = "expected a number greater than " + fmt(lowExclusive) + " and at most " + fmt(max);
        if (n == null) return dflt;
        if (!n.isNumber()) throw error(key, expected + ", got " + shown(n));
        double v = n.asDouble();
        if (!(v > lowExclusive && v <= max)) throw error(key, expected + ", got " + shown(n));
        return v;
    }

    int integer(String key, int dflt, int min, int max) {
        JsonNode n = raw(key);
        String expected = "expected a whole number from " + min + " to " + max;
        if (n == null) return dflt;
        if (!n.isNumber() || !n.canConvertToExactIntegral()) throw error(key, expected + ", got " + shown(n));
        double v = n.asDouble();
        if (!(v >= min && v <= max)) throw error(key, expected + ", got " + shown(n));
        return (int) v;
    }

    boolean bool(String key, boolean dflt) {
        JsonNode n = raw(key);
        if (n == null) return dflt;
        if (!n.isBoolean()) throw error(key, "expected true or false, got " + shown(n));
        return n.asBoolean();
    }

    /** One of an enum's labels (lower case, '-' between words). */
    <E extends Enum<E> & Study.Named> E choice(String key, Class<E> type, E dflt) {
        return choice(key, type.getEnumConstants(), Study.Named::label, dflt);
    }

    /**
     * One of an enum's labels, or (as a second spelling) its constant's name in lower case with '-'
     * between words; the message lists the labels.
     */
    <E extends Enum<E>> E choice(String key, E[] all, Function<E, String> label, E dflt) {
        JsonNode n = raw(key);
        if (n == null) return dflt;
        List<String> labels = new ArrayList<>();
        for (E e : all) labels.add(label.apply(e));
        String expected = "expected one of " + String.join(", ", labels);
        if (!n.isTextual()) throw error(key, expected + ", got " + shown(n));
        String s = n.asText().trim();
        for (E e : all) if (label.apply(e).equalsIgnoreCase(s) || Study.Named.labelOf(e).equalsIgnoreCase(s)) return e;
        throw error(key, expected + ", got " + shown(n));
    }

    /** One of the given names (any case), returned as listed; the message lists them all. */
    String oneOf(String key, List<String> names, String dflt) {
        JsonNode n = raw(key);
        if (n == null) return dflt;
        String expected = "expected one of " + String.join(", ", names);
        if (!n.isTextual()) throw error(key, expected + ", got " + shown(n));
        String s = n.asText().trim();
        for (String name : names) if (name.equalsIgnoreCase(s)) return name;
        throw error(key, expected + ", got " + shown(n));
    }

    /** An array of non-empty, distinct texts; absent gives an empty list. */
    List<String> strings(String key) {
        JsonNode n = raw(key);
        List<String> out = new ArrayList<>();
        if (n == null) return out;
        if (!n.isArray()) throw error(key, "expected an array of names [\"A\", \"B\"], got " + shown(n));
        for (int i = 0; i < n.size(); i++) {
            JsonNode e = n.get(i);
            if (!e.isTextual() || e.asText().isEmpty()) {
                throw error(key + "[" + i + "]", "expected a name in quotes, got " + shown(e));
            }
            if (out.contains(e.asText())) throw error(key + "[" + i + "]", "\"" + e.asText() + "\" is listed twice");
            out.add(e.asText());
        }
        return out;
    }

    /** An array of numbers in [min, max], strictly ascending. */
    List<Double> ascendingNumbers(String key, List<Double> dflt, double min, double max, int maxCount) {
        JsonNode n = raw(key);
        if (n == null) return dflt;
        if (!n.isArray()) throw error(key, "expected an array of numbers [300, 600], got " + shown(n));
        if (n.size() > maxCount) throw error(key, "expected at most " + maxCount + " numbers, got " + n.size());
        List<Double> out = new ArrayList<>();
        for (int i = 0; i < n.size(); i++) {
            JsonNode e = n.get(i);
            if (!e.isNumber() || !(e.asDouble() >= min && e.asDouble() <= max)) {
                throw error(key + "[" + i + "]", "expected a number from " + fmt(min) + " to " + fmt(max) + ", got " + shown(e));
            }
            if (!out.isEmpty() && e.asDouble() <= out.get(out.size() - 1)) {
                throw error(key + "[" + i + "]", "expected numbers in ascending order, got " + shown(e) + " after " + fmt(out.get(out.size() - 1)));
            }
            out.add(e.asDouble());
        }
        return out;
    }

    /** A map of names to numbers in [min, max] (e.g. albedo.blocks); absent gives an empty map. */
    Map<String, Double> numberMap(String key, double min, double max) {
        JsonCursor m = object(key);
        Map<String, Double> out = new java.util.LinkedHashMap<>();
        Iterator<String> names = m.node.fieldNames();
        while (names.hasNext()) {
            String name = names.next();
            out.put(name, m.number(name, null, min, max));
        }
        return out;
    }

    /** The keys of this object, in file order. */
    List<String> keys() {
        List<String> out = new ArrayList<>();
        node.fieldNames().forEachRemaining(out::add);
        return out;
    }

    /** Fails on the first key of this object that no getter asked for. */
    void finish() {
        List<String> known = new ArrayList<>(seen);
        Iterator<String> names = node.fieldNames();
        while (names.hasNext()) {
            String k = names.next();
            if (!seen.contains(k)) {
                throw error(k, "unknown key; expected one of " + String.join(", ", known));
            }
        }
    }

    static String shown(JsonNode n) {
        String s = n.toString();
        return s.length() > 60 ? s.substring(0, 57) + "..." : s;
    }

    static String fmt(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) return Long.toString((long) v);
        return Double.toString(v);
    }
}
