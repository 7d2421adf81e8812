package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.fabspread.sampling.Interval;
import org.junit.jupiter.api.Test;

class DocumentModelTest {

    @Test
    void tableRowsMatchTheHeader() {
        assertThrows(IllegalArgumentException.class, () -> Table.of("t", List.of("a", "b"), List.of(List.of("1"))));
        assertThrows(IllegalArgumentException.class, () -> new Table("t", List.of("a"), List.of(), List.of()));
        assertThrows(IllegalArgumentException.class, () -> Table.of("t", List.of(), List.of()));
    }

    @Test
    void numericColumnsAreDetected() {
        // common practice: numbers right-aligned so that digits line up, text left
        Table t = Table.of("t", List.of("name", "value", "yield", "range", "mixed"), List.of(
                List.of("a", "12.5", "87.3 %", "0.49–0.56", "1"),
                List.of("b", "−3e-4", "", "2-5", "n/a")));
        assertEquals(List.of(Table.Align.LEFT, Table.Align.RIGHT, Table.Align.RIGHT, Table.Align.RIGHT, Table.Align.LEFT),
                t.alignment());
    }

    @Test
    void sectionIdsAreAnchorsAndUnique() {
        assertThrows(IllegalArgumentException.class, () -> new Section("1abc", "t"));
        assertThrows(IllegalArgumentException.class, () -> new Section("a b", "t"));
        assertThrows(IllegalArgumentException.class, () -> new Section("a\"", "t"));
        assertThrows(IllegalArgumentException.class, () -> new ReportDocument("r", "", List.of(
                new Section("a", "A"), new Section("a", "B"))));
    }

    @Test
    void recordsAreImmutableCopies() {
        List<String> items = new ArrayList<>(List.of("x"));
        BulletList b = new BulletList(items);
        items.add("y");
        assertEquals(List.of("x"), b.items());
        assertThrows(UnsupportedOperationException.class, () -> b.items().add("z"));
        assertThrows(IllegalArgumentException.class, () -> new BulletList(List.of()));
    }

    @Test
    void intervalsEncloseTheirEstimateAndQuantitiesHaveUnits() {
        ChartFactory f = new ChartFactory();
        double[] v = {14, 15, 16, 17};
        Quantity q = Quantity.of("J_sc", "mA/cm²");
        assertThrows(IllegalArgumentException.class, () -> f.histogram("h", "t", q, v, 15, true, 0.9, new Interval(0.91, 0.95)));
        assertThrows(IllegalArgumentException.class, () -> f.histogram("h", "t", q, v, 15, true, Double.NaN, new Interval(0, 1)));
        assertEquals("J_sc (mA/cm²)", Quantity.of("J_sc", "mA/cm²").axisTitle());
        assertEquals("S_i (–)", Quantity.dimensionless("S_i").axisTitle());
        assertThrows(IllegalArgumentException.class, () -> Quantity.of("x", ""));
    }
}
