package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.solmass.metrics.ColumnCatalogue;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;
import org.solmass.table.ColumnKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** docs/outputs.md and the column declarations are one fact: the docs' table is the catalogue's. */
class OutputsDocTest {
    @Test
    void outputsDocCarriesTheCatalogueTableVerbatim() throws Exception {
        String doc = Files.readString(Path.of("docs/outputs.md"));
        String table = ColumnCatalogue.markdownTable();
        assertTrue(doc.contains(table), "docs/outputs.md must contain, verbatim, the result-column table:\n" + table);
    }

    @Test
    void everyDeclaredColumnHasAUniqueNameALabelAndADescription() {
        Set<String> names = new HashSet<>();
        for (ColumnFamily f : ColumnCatalogue.families()) {
            Column c = f.example();
            assertTrue(names.add(c.name()), "declared twice: " + c.name());
            assertFalse(c.label().isBlank(), c.name());
            assertFalse(c.label().contains("_"), "a label is for people, not a column name: " + c.label());
            assertTrue(c.description().endsWith("."), c.name());
            assertEquals(c, ColumnCatalogue.of(c.name()), "the catalogue finds " + c.name() + " by its name");
        }
    }

    @Test
    void familiesResolveEveryMemberAndRefuseNonDates() {
        assertEquals("Sun hours on 21 June", ColumnCatalogue.of("sun_hours_0621").label());
        assertEquals(ColumnKind.INTEGER, ColumnCatalogue.of("sun_level_0201").kind());
        assertEquals("December irradiation", ColumnCatalogue.of("m12_kwh_m2").label());
        assertFalse(ColumnCatalogue.declared("sun_hours_0231").isPresent(), "31 February is no date");
        assertFalse(ColumnCatalogue.declared("m13_kwh_m2").isPresent());
        Column d = ColumnCatalogue.of("delta_annual_kwh_m2");
        assertEquals(ColumnKind.DIVERGING, d.kind());
        assertEquals("Change in annual irradiation (B - A)", d.label());
        assertEquals(2, d.decimals());
        assertEquals(0, ColumnCatalogue.of("pv_zone").decimals(), "zone numbers print as whole numbers");
    }
}
