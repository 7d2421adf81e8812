package org.fabspread.parquet;

import java.util.HashMap;
import java.util.List;

import org.apache.hadoop.conf.Configuration;
import org.apache.parquet.hadoop.ParquetWriter;
import org.apache.parquet.hadoop.api.WriteSupport;
import org.apache.parquet.io.OutputFile;
import org.apache.parquet.io.api.Binary;
import org.apache.parquet.io.api.RecordConsumer;
import org.apache.parquet.schema.LogicalTypeAnnotation;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.PrimitiveType.PrimitiveTypeName;
import org.apache.parquet.schema.Types;
import org.fabspread.sampling.Chunk;
import org.fabspread.sampling.SamplesCsv;

/**
 * Writes the rows of one {@link Chunk} as Parquet records, straight from its arrays (the record is the
 * row's index in the chunk): {@code sample}, the inputs, the outputs, {@code status}.
 */
final class ChunkRows extends WriteSupport<Integer> {

    private final List<String> columns;
    private final Chunk chunk;
    private final MessageType schema;
    private RecordConsumer out;

    ChunkRows(List<String> columns, Chunk chunk) {
        this.columns = columns;
        this.chunk = chunk;
        Types.MessageTypeBuilder b = Types.buildMessage();
        b.required(PrimitiveTypeName.INT64).named("sample");
        for (String c : columns) {
            b.required(PrimitiveTypeName.DOUBLE).named(c);
        }
        b.required(PrimitiveTypeName.BINARY).as(LogicalTypeAnnotation.stringType()).named("status");
        this.schema = b.named("samples");
    }

    @Override
    public WriteContext init(Configuration configuration) {
        return new WriteContext(schema, new HashMap<>());
    }

    @Override
    public void prepareForWrite(RecordConsumer recordConsumer) {
        this.out = recordConsumer;
    }

    @Override
    public void write(Integer row) {
        int r = row;
        int k = chunk.inputs();
        int m = chunk.outputs();
        out.startMessage();
        out.startField("sample", 0);
        out.addLong(chunk.first() + r);
        out.endField("sample", 0);
        for (int i = 0; i < k; i++) {
            field(1 + i, chunk.x()[r * k + i]);
        }
        for (int j = 0; j < m; j++) {
            field(1 + k + j, chunk.y()[r * m + j]);
        }
        int s = 1 + k + m;
        String status = chunk.status()[r];
        out.startField("status", s);
        out.addBinary(Binary.fromString(status == null ? SamplesCsv.OK : status));
        out.endField("status", s);
        out.endMessage();
    }

    private void field(int index, double value) {
        String name = columns.get(index - 1);
        out.startField(name, index);
        out.addDouble(value);
        out.endField(name, index);
    }

    /** The writer's builder for one chunk's file. */
    static final class Builder extends ParquetWriter.Builder<Integer, Builder> {
        private final ChunkRows rows;

        Builder(OutputFile file, ChunkRows rows) {
            super(file);
            this.rows = rows;
        }

        @Override
        protected Builder self() {
            return this;
        }

        @Override
        protected WriteSupport<Integer> getWriteSupport(Configuration conf) {
            return rows;
        }
    }
}
