package org.solmass;

/**
 * A problem with what the user gave Solmass: a file, a line of a file, a key of a study file or a
 * command-line flag. The message always names where the problem is and what was expected. The CLI
 * maps it to exit code 2.
 */
public class InputException extends RuntimeException {
    private final String where;
    private final String detail;

    /**
     * @param where the file (with ":line" when known), study key or flag the problem is in
     * @param message what is wrong and what was expected
     */
    public InputException(String where, String message) {
        super(where == null || where.isEmpty() ? message : where + ": " + message);
        this.where = where;
        this.detail = message;
    }

    public InputException(String where, String message, Throwable cause) {
        super(where == null || where.isEmpty() ? message : where + ": " + message, cause);
        this.where = where;
        this.detail = message;
    }

    /** The same problem with a further sentence appended (e.g. the warnings that probably explain it). */
    public InputException withHint(String hint) {
        return new InputException(where, detail + hint, this);
    }

    /** Where the problem is: "file:line", "file", a study key or a flag. */
    public String where() {
        return where;
    }

    /** "file:line" location string. */
    public static String at(Object file, int line) {
        return file + ":" + line;
    }
}
