package org.fabspread.parquet;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;

import org.apache.parquet.hadoop.ParquetFileWriter;
import org.apache.parquet.hadoop.ParquetWriter;
import org.apache.parquet.hadoop.metadata.CompressionCodecName;
import org.apache.parquet.io.LocalOutputFile;
import org.fabspread.sampling.Chunk;
import org.fabspread.sampling.ChunkStore;
import org.fabspread.study.StudyException;

/**
 * The samples as Apache Parquet files partitioned by chunk (Apache Parquet format specification,
 * parquet.apache.org): {@code FOLDER/chunk=00000/part-0.parquet}, one file per chunk with the columns of
 * {@code samples.csv} — {@code sample} (int64), every input and output (double; NaN for a failed row's
 * outputs) and {@code status} (UTF-8 string, {@code ok} or the failure reason). The {@code chunk=N} folder
 * names are Hive-style partitions, which pyarrow, pandas and Spark SQL read as a {@code chunk} column.
 * Each file is written by whoever evaluated the chunk (a local worker thread or a Spark executor) to a
 * hidden temporary file beside it and renamed into place, so a retried task replaces it with the same
 * bytes and a reader never sees half a file. Uncompressed: the columns are doubles, which compress little.
 *
 * @param folder  the dataset's folder, absolute
 * @param columns inputs then outputs, the chunk's order
 */
public record ParquetSamples(String folder, List<String> columns) implements ChunkStore {

    /** The dataset folder's name in the results folder. */
    public static final String FOLDER = "samples.parquet";

    /** Makes the store, after checking that Parquet is on the class path. */
    private static final ChunkStore.Maker MAKER = (dir, cols) -> new ParquetSamples(dir.toAbsolutePath().toString(),
            List.copyOf(cols));

    private static final AtomicLong TEMPORARY = new AtomicLong();

    public ParquetSamples {
        columns = List.copyOf(columns);
    }

    /** The maker, or a one-line refusal when Apache Parquet (and the Hadoop it needs) is not on the class path. */
    public static ChunkStore.Maker maker() {
        try {
            Class.forName("org.apache.parquet.hadoop.ParquetWriter", false, ParquetSamples.class.getClassLoader());
            Class.forName("org.apache.hadoop.conf.Configuration", false, ParquetSamples.class.getClassLoader());
        } catch (ClassNotFoundException e) {
            throw new StudyException("--samples-format parquet: Apache Parquet is not on the class path; start"
                    + " through the ./fabspread launcher (which adds it) or spark-submit");
        }
        return MAKER;
    }

    /** The file of chunk {@code index} under {@code folder}. */
    public static Path file(Path folder, long index) {
        return folder.resolve(String.format(Locale.ROOT, "chunk=%05d", index)).resolve("part-0.parquet");
    }

    @Override
    public void write(Chunk chunk) throws IOException {
        if (columns.size() != chunk.inputs() + chunk.outputs()) {
            throw new IllegalArgumentException(columns.size() + " column names for " + chunk.inputs() + " inputs and "
                    + chunk.outputs() + " outputs");
        }
        Path target = file(Path.of(folder), chunk.index());
        Files.createDirectories(target.getParent());
        Path tmp = target.resolveSibling(".part-0.parquet." + ProcessHandle.current().pid() + "-"
                + TEMPORARY.incrementAndGet() + ".tmp");
        ChunkRows rows = new ChunkRows(columns, chunk);
        try {
            try (ParquetWriter<Integer> w = new ChunkRows.Builder(new LocalOutputFile(tmp), rows)
                    .withCompressionCodec(CompressionCodecName.UNCOMPRESSED)
                    .withWriteMode(ParquetFileWriter.Mode.OVERWRITE).build()) {
                for (int r = 0; r < chunk.count(); r++) {
                    w.write(r);
                }
            }
            Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
