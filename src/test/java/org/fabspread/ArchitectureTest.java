package org.fabspread;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;

/**
 * Holds the package dependency rules of DEVELOPERS.md to the source: a package may import only the
 * packages listed for it (common practice: layered architecture checked on imports).
 */
class ArchitectureTest {

    private static final Map<String, Set<String>> ALLOWED = Map.ofEntries(
            Map.entry("model", Set.of()),
            Map.entry("io", Set.of()),
            Map.entry("study", Set.of("model", "io")),
            Map.entry("optics", Set.of("study", "io")),
            Map.entry("particles", Set.of("optics", "study")),
            Map.entry("shapes", Set.of("study", "io")),
            Map.entry("dda", Set.of("shapes", "optics", "particles", "io")),
            Map.entry("device", Set.of("model", "study", "optics", "particles", "io", "shapes", "dda")),
            Map.entry("sampling", Set.of("model", "study", "io")),
            Map.entry("analysis", Set.of("model", "sampling", "study", "io")),
            Map.entry("plan", Set.of("model", "sampling", "study", "analysis", "io")),
            Map.entry("pipeline", Set.of("model", "sampling", "study", "analysis", "plan", "device", "optics",
                    "particles", "io", "shapes", "dda")),
            Map.entry("report", Set.of("model", "sampling", "study", "analysis", "plan", "device", "optics",
                    "particles", "io", "pipeline", "shapes", "dda")),
            Map.entry("spark", Set.of("model", "sampling", "study", "device")),
            Map.entry("parquet", Set.of("sampling", "study")),
            Map.entry("cli", Set.of("model", "sampling", "study", "analysis", "plan", "device", "optics",
                    "particles", "io", "pipeline", "report", "shapes", "dda", "spark", "parquet")));

    private static final Pattern IMPORT = Pattern.compile("^import\\s+(?:static\\s+)?org\\.fabspread\\.(\\w+)\\.",
            Pattern.MULTILINE);
    private static final Pattern QUALIFIED = Pattern.compile("\\borg\\.fabspread\\.(\\w+)\\.[A-Z]");

    @Test
    void packagesImportOnlyWhatTheGuideAllows() throws IOException {
        Path root = Path.of("src/main/java/org/fabspread");
        List<String> violations = new ArrayList<>();
        try (Stream<Path> files = Files.walk(root)) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                Path rel = root.relativize(f);
                if (rel.getNameCount() < 2) {
                    continue;
                }
                String pkg = rel.getName(0).toString();
                Set<String> allowed = ALLOWED.get(pkg);
                assertTrue(allowed != null, "package " + pkg + " is not described in DEVELOPERS.md");
                String text = stripComments(Files.readString(f, StandardCharsets.UTF_8));
                for (Pattern p : List.of(IMPORT, QUALIFIED)) {
                    Matcher m = p.matcher(text);
                    while (m.find()) {
                        String used = m.group(1);
                        if (!used.equals(pkg) && !allowed.contains(used)) {
                            violations.add(rel + " uses org.fabspread." + used);
                        }
                    }
                }
            }
        }
        assertTrue(violations.isEmpty(), "dependency rule broken:\n" + String.join("\n", violations));
    }

    /** Spark is provided by the cluster, not shaded into the jar: only the cluster engine's package may use it. */
    @Test
    void onlyTheSparkPackageImportsSpark() throws IOException {
        Path root = Path.of("src/main/java/org/fabspread");
        List<String> violations = new ArrayList<>();
        try (Stream<Path> files = Files.walk(root)) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                Path rel = root.relativize(f);
                String text = stripComments(Files.readString(f, StandardCharsets.UTF_8));
                if (!rel.startsWith("spark") && text.contains("org.apache.spark")) {
                    violations.add(rel.toString());
                }
            }
        }
        assertTrue(violations.isEmpty(), "only org.fabspread.spark may use org.apache.spark:\n"
                + String.join("\n", violations));
    }

    /** Parquet and the Hadoop classes it needs are provided, not shaded: only the Parquet samples package uses them. */
    @Test
    void onlyTheParquetPackageImportsParquetOrHadoop() throws IOException {
        Path root = Path.of("src/main/java/org/fabspread");
        List<String> violations = new ArrayList<>();
        try (Stream<Path> files = Files.walk(root)) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                Path rel = root.relativize(f);
                String text = stripComments(Files.readString(f, StandardCharsets.UTF_8));
                if (!rel.startsWith("parquet") && (text.contains("org.apache.parquet") || text.contains("org.apache.hadoop"))) {
                    violations.add(rel.toString());
                }
            }
        }
        assertTrue(violations.isEmpty(), "only org.fabspread.parquet may use org.apache.parquet and org.apache.hadoop:\n"
                + String.join("\n", violations));
    }

    /** Javadoc may name any class; only code counts. */
    private static String stripComments(String s) {
        return s.replaceAll("(?s)/\\*.*?\\*/", " ").replaceAll("//[^\n]*", " ");
    }
}
