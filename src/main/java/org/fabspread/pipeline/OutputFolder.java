package org.fabspread.pipeline;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.fabspread.io.AtomicFiles;
import org.fabspread.study.StudyException;

/**
 * The results folder of one run, written as a transaction. The run works in a staging folder beside it,
 * {@code NAME.incomplete/}, labelled by {@value #LABEL}; only when every file is written is the staging
 * folder renamed to {@code NAME} (an earlier result there moved aside first and deleted after), so the
 * results folder appears complete or not at all and holds exactly the files of this run. An interrupted
 * run stays in the staging folder for {@code --resume}; a fresh run replaces it and says so.
 *
 * <p>The folder is owned by the run: an empty name, the root, the current folder and a file are refused;
 * an existing folder must be empty or hold the results of a run of the same study and seed ({@code force}
 * replaces a run of another study or seed); a folder holding anything else is refused, naming what is in it.
 */
public final class OutputFolder {

    /** The label file of a staging folder. */
    public static final String LABEL = "INCOMPLETE.txt";
    /** The suffix of the staging folder's name. */
    public static final String STAGING_SUFFIX = ".incomplete";
    private static final ObjectMapper JSON = new ObjectMapper();

    private final Path target;
    private final Path staging;
    private final boolean resume;
    private final String replacing;

    private OutputFolder(Path target, Path staging, boolean resume, String replacing) {
        this.target = target;
        this.staging = staging;
        this.resume = resume;
        this.replacing = replacing;
    }

    /**
     * Decides where the run writes, touching nothing: refuses an unusable {@code --out} in one line.
     *
     * @param out    the results folder as the user named it
     * @param resume continue the unfinished run of this folder
     * @param force  replace results of another study or seed
     * @param study  this run's study name
     * @param seed   this run's seed
     */
    public static OutputFolder plan(Path out, boolean resume, boolean force, String study, long seed)
            throws IOException {
        if (out == null || out.toString().isBlank()) {
            throw new StudyException("--out: the folder name is empty; name a folder for the results");
        }
        Path abs = out.toAbsolutePath().normalize();
        if (abs.getParent() == null || abs.getFileName() == null) {
            throw new StudyException("--out " + out + ": the root folder cannot hold results; name a folder of its own");
        }
        if (abs.equals(Path.of("").toAbsolutePath().normalize())) {
            throw new StudyException("--out " + out + ": the current folder cannot be replaced by results; name a"
                    + " new folder");
        }
        if (Files.exists(abs) && !Files.isDirectory(abs)) {
            throw new StudyException("--out " + out + ": is a file, not a folder");
        }
        Path staging = abs.resolveSibling(abs.getFileName() + STAGING_SUFFIX);
        if (Files.exists(staging) && !Files.isRegularFile(staging.resolve(LABEL))) {
            throw new StudyException("--out " + out + ": " + staging.getFileName() + " exists beside it and is not"
                    + " an unfinished fabspread run; move it away");
        }
        if (resume && !Files.isDirectory(staging)) {
            throw new StudyException("--out " + out + ": nothing to resume (no unfinished run "
                    + staging.getFileName() + " beside it)");
        }
        return new OutputFolder(abs, staging, resume, earlier(out, abs, force, study, seed));
    }

    /** What an existing results folder holds, or null when it is absent or empty; refuses foreign content. */
    private static String earlier(Path out, Path abs, boolean force, String study, long seed) throws IOException {
        if (!Files.isDirectory(abs)) {
            return null;
        }
        List<String> names = new ArrayList<>();
        try (DirectoryStream<Path> d = Files.newDirectoryStream(abs)) {
            for (Path p : d) {
                names.add(p.getFileName().toString());
            }
        }
        if (names.isEmpty()) {
            return null;
        }
        JsonNode summary = null;
        Path file = abs.resolve(SummaryJson.FILE);
        if (Files.isRegularFile(file)) {
            try {
                summary = JSON.readTree(file.toFile());
            } catch (IOException e) {
                summary = null;
            }
        }
        if (summary == null || !summary.path("study").isTextual() || !summary.path("seed").canConvertToLong()) {
            names.sort(null);
            throw new StudyException("--out " + out + ": holds files that are not fabspread results ("
                    + String.join(", ", names.subList(0, Math.min(5, names.size())))
                    + (names.size() > 5 ? ", …" : "") + "); name a new or empty folder");
        }
        String oldStudy = summary.path("study").asText();
        long oldSeed = summary.path("seed").asLong();
        String what = "study '" + Terminal.printable(oldStudy) + "', seed " + oldSeed;
        if (!force && (!oldStudy.equals(study) || oldSeed != seed)) {
            throw new StudyException("--out " + out + ": holds the results of " + what + "; this run is study '"
                    + Terminal.printable(study) + "', seed " + seed + "; use --force to replace them or name another"
                    + " folder");
        }
        return what;
    }

    /**
     * Creates the staging folder (or, resuming, keeps it) and says on {@code log} what the run replaces.
     */
    public void open(PrintWriter log, String label) throws IOException {
        if (!resume && Files.exists(staging)) {
            log.println("replacing the unfinished run in " + staging + " (--resume would have continued it)");
            deleteTree(staging);
        }
        if (replacing != null) {
            log.println("replacing the results of " + replacing + " in " + target);
        }
        try {
            Files.createDirectories(staging);
            AtomicFiles.writeString(staging.resolve(LABEL), label);
        } catch (IOException e) {
            if (!resume) {
                // an unlabelled staging folder would block the next run: this run has nothing in it yet
                try {
                    deleteTree(staging);
                } catch (IOException ignored) {
                    e.addSuppressed(ignored);
                }
            }
            throw e;
        }
        log.flush();
    }

    /** The staging folder exists and carries its label (an unfinished run that {@code --resume} continues). */
    public boolean labelled() {
        return Files.isRegularFile(staging.resolve(LABEL));
    }

    /** Where the run writes its files. */
    public Path work() {
        return staging;
    }

    /** The results folder. */
    public Path target() {
        return target;
    }

    public boolean resuming() {
        return resume;
    }

    /**
     * Publishes the staging folder as the results folder: removes the run's bookkeeping files
     * ({@code bookkeeping}, the label, unfinished temporary files), moves an earlier result aside, renames,
     * then deletes the earlier result.
     */
    public void commit(List<String> bookkeeping) throws IOException {
        for (String name : bookkeeping) {
            Path p = staging.resolve(name);
            if (Files.isDirectory(p)) {
                deleteTree(p);
            } else {
                Files.deleteIfExists(p);
            }
        }
        deleteTemporaries(staging);
        Files.delete(staging.resolve(LABEL));
        Path old = null;
        if (Files.exists(target)) {
            old = target.resolveSibling("." + target.getFileName() + ".replaced-" + ProcessHandle.current().pid());
            move(target, old);
        }
        move(staging, target);
        if (old != null) {
            deleteTree(old);
        }
    }

    /** Deletes the staging folder (after a refusal or a fault: no half-written result stays). */
    public void discard() {
        try {
            if (Files.isRegularFile(staging.resolve(LABEL))) {
                deleteTree(staging);
            }
        } catch (IOException e) {
            // best effort: the folder is labelled unfinished either way
        }
    }

    private static void deleteTemporaries(Path dir) throws IOException {
        Files.walkFileTree(dir, new SimpleFileVisitor<>() {
            @Override
            public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
                String n = file.getFileName().toString();
                if (n.startsWith(".") && n.endsWith(".part")) {
                    Files.delete(file);
                }
                return FileVisitResult.CONTINUE;
            }
        });
    }

    /** Deletes a folder and everything under it; symbolic links are removed, never followed. */
    static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        Files.walkFileTree(dir, new SimpleFileVisitor<>() {
            @Override
            public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
                Files.delete(file);
                return FileVisitResult.CONTINUE;
            }

            @Override
            public FileVisitResult postVisitDirectory(Path d, IOException e) throws IOException {
                if (e != null) {
                    throw e;
                }
                Files.delete(d);
                return FileVisitResult.CONTINUE;
            }
        });
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to);
        }
    }
}
