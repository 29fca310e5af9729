package org.solmass.table;

import java.util.List;
import java.util.Optional;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A set of result columns declared together: either one fixed column, or a family of names that share
 * a pattern ({@code m01_kwh_m2} ... {@code m12_kwh_m2}, {@code sun_hours_MMDD}) and are made from the
 * name on demand. A stage declares its columns as families so that a reader can turn any header name
 * back into its {@link Column}.
 *
 * @param docName how docs/outputs.md names the family ({@code m01_kwh_m2 ... m12_kwh_m2})
 * @param pattern names of the family
 * @param make the column of a matching name
 * @param example one column of the family (its unit, decimals and description stand for all)
 */
public record ColumnFamily(String docName, Pattern pattern, Function<Matcher, Column> make, Column example) {

    /** A family of one fixed column. */
    public static ColumnFamily of(Column c) {
        return new ColumnFamily(c.name(), Pattern.compile(Pattern.quote(c.name())), m -> c, c);
    }

    /** Families of fixed columns. */
    public static List<ColumnFamily> of(Column... cs) {
        return java.util.Arrays.stream(cs).map(ColumnFamily::of).toList();
    }

    /** The column of {@code name}, when the name belongs to this family. */
    public Optional<Column> match(String name) {
        Matcher m = pattern.matcher(name);
        if (!m.matches()) return Optional.empty();
        try {
            return Optional.of(make.apply(m));
        } catch (RuntimeException e) {   // the pattern matched but the name is none of the family (a date 02-31)
            return Optional.empty();
        }
    }
}
