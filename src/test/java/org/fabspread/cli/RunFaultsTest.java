package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Faults found while running, through the command a user types: a study whose Monte Carlo rejects some
 * samples still finishes; an unfinished run whose files were changed or cut short is refused in one line
 * (SHA-256 digests, FIPS 180-4), not resumed.
 */
class RunFaultsTest {

    @TempDir
    Path tmp;

    @Test
    void theDemoWithAWideDiameterSpreadIsRefusedBeforeAnythingIsWritten() throws IOException {
        // a spread that reaches non-positive diameters once died after the Monte Carlo run; it is now refused
        // up front, in one line, with no folder left
        String demo = Files.readString(Path.of("demo-studies/pilot-line-inverted.yaml"), StandardCharsets.UTF_8);
        String wide = demo.replace("diameter: {lognormal: {median: 20 nm, cv: 8 %}}", "diameter: 20 nm ± 15 nm at 2 sigma");
        assertFalse(wide.equals(demo), "the demo's diameter line moved");
        Path study = Files.writeString(tmp.resolve("wide.yaml"), wide);
        Path out = tmp.resolve("out");
        OutputFolderTest.Run r = OutputFolderTest.cli("run", study.toString(), "--out", out.toString(), "--samples",
                "400", "--threads", "2", "--no-report");
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertTrue(r.err().strip().startsWith("fabspread: wide.yaml:") && r.err().contains("particles.diameter: "), r.err());
        assertFalse(r.err().strip().contains("\n"), r.err());
        assertFalse(Files.exists(out) || Files.exists(tmp.resolve("out.incomplete")), "no folder left");
    }

    @Test
    void changedOrDamagedFilesOfAnUnfinishedRunAreRefusedInOneLine() throws Exception {
        Path out = tmp.resolve("stopped");
        Path staging = tmp.resolve("stopped.incomplete");
        Process p = new ProcessBuilder(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), "org.fabspread.cli.Main", "run",
                InterruptedRunTest.STUDY.toString(), "--out", out.toString(), "--threads", "2", "--no-report"))
                .redirectErrorStream(true).redirectOutput(tmp.resolve("log.txt").toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (p.isAlive() && !InterruptedRunTest.state(staging).contains("monte_carlo")
                && System.nanoTime() < deadline) {
            Thread.sleep(10);
        }
        assertTrue(p.isAlive(), "the run ended before the Monte Carlo phase was recorded");
        p.destroyForcibly();
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));

        // one changed digit in the finished samples
        Path samples = staging.resolve("samples.csv");
        String text = Files.readString(samples);
        int at = text.indexOf('\n') + 1;
        at = text.indexOf(',', at) + 1;
        char c = text.charAt(at);
        Files.writeString(samples, text.substring(0, at) + (c == '9' ? '8' : (char) (c + 1)) + text.substring(at + 1));
        OutputFolderTest.Run r = OutputFolderTest.cli("run", InterruptedRunTest.STUDY.toString(), "--out",
                out.toString(), "--threads", "2", "--no-report", "--resume");
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals("fabspread: " + samples + ": changed since the run wrote it (SHA-256 differs); cannot resume; run again without"
                + " --resume", r.err().strip());
        assertFalse(Files.exists(out));

        // a damaged state file
        Files.writeString(staging.resolve("run-state.json"), "{\"run\": ");
        r = OutputFolderTest.cli("run", InterruptedRunTest.STUDY.toString(), "--out", out.toString(), "--threads", "2",
                "--no-report", "--resume");
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals("fabspread: " + staging.resolve("run-state.json") + ": damaged (not the state this program wrote); run again"
                + " without --resume", r.err().strip());

        // a fresh run replaces the unfinished one and says so
        r = OutputFolderTest.cli("run", InterruptedRunTest.STUDY.toString(), "--out", out.toString(), "--threads", "2",
                "--no-report", "--samples", "200");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("replacing the unfinished run in " + staging), r.out());
        assertFalse(Files.exists(staging));
    }

    @Test
    void changedCheckpointOrPartialSamplesOfAnInterruptedMonteCarloAreRefusedInOneLine() throws Exception {
        Path out = tmp.resolve("mc");
        Path staging = tmp.resolve("mc.incomplete");
        Path checkpoint = staging.resolve("checkpoint.json");
        List<String> run = List.of("run", InterruptedRunTest.STUDY.toString(), "--out", out.toString(), "--threads",
                "1", "--no-report", "--samples", "400000");
        List<String> cmd = new java.util.ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java")
                .toString(), "-cp", System.getProperty("java.class.path"), "org.fabspread.cli.Main"));
        cmd.addAll(run);
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(tmp.resolve("log.txt").toFile())
                .start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (p.isAlive() && !Files.isRegularFile(checkpoint) && System.nanoTime() < deadline) {
            Thread.sleep(10);
        }
        assertTrue(p.isAlive(), "the run ended before its first checkpoint");
        p.destroyForcibly();
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        assertFalse(InterruptedRunTest.state(staging).contains("monte_carlo"), "killed inside the Monte Carlo phase");
        Path part = staging.resolve("samples.csv.part");
        byte[] partBytes = Files.readAllBytes(part);
        String ck = Files.readString(checkpoint);
        String[] resume = java.util.stream.Stream.concat(run.stream(), java.util.stream.Stream.of("--resume"))
                .toArray(String[]::new);

        // one changed digit in the partial samples (inside the bytes the checkpoint covers)
        byte[] changed = partBytes.clone();
        int at = new String(changed, StandardCharsets.UTF_8).indexOf('\n') + 1;
        while (!Character.isDigit(changed[at]) || changed[at] == '9') {
            at++;
        }
        changed[at]++;
        Files.write(part, changed);
        OutputFolderTest.Run r = OutputFolderTest.cli(resume);
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals("fabspread: " + part + ": changed since its checkpoint was written (SHA-256 differs); cannot resume; run again"
                + " without --resume", r.err().strip());
        Files.write(part, partBytes);

        // a damaged checkpoint
        Files.writeString(checkpoint, ck.substring(0, ck.length() / 2));
        r = OutputFolderTest.cli(resume);
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals("fabspread: " + checkpoint + ": not a checkpoint this version can read (damaged or changed); run again without"
                + " --resume", r.err().strip());

        // a checkpoint claiming one chunk more than the partial samples hold (the digest still matches)
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("\"chunksDone\" : (\\d+)").matcher(ck);
        assertTrue(m.find(), ck);
        long done = Long.parseLong(m.group(1));
        Files.writeString(checkpoint, m.replaceFirst("\"chunksDone\" : " + (done + 1)));
        r = OutputFolderTest.cli(resume);
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals("fabspread: " + checkpoint + ": says " + (done + 1) + " chunks of 1024 samples are done, but samples.csv.part"
                + " holds " + done * 1024 + " samples (damaged or changed); cannot resume; run again without --resume",
                r.err().strip());
        assertFalse(Files.exists(out), "no results folder");
        assertTrue(Files.isDirectory(staging), "the unfinished run is kept");
    }
}
