package org.fabspread.spark;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.apache.parquet.column.page.PageReadStore;
import org.apache.parquet.example.data.Group;
import org.apache.parquet.example.data.simple.convert.GroupRecordConverter;
import org.apache.parquet.hadoop.ParquetFileReader;
import org.apache.parquet.io.ColumnIOFactory;
import org.apache.parquet.io.LocalInputFile;
import org.apache.parquet.io.RecordReader;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.PrimitiveType.PrimitiveTypeName;
import org.apache.parquet.schema.Type;

/** Reads a Parquet file back with parquet-hadoop's own reader and its example record model (test helper). */
final class ParquetRows {

    private ParquetRows() {
    }

    /** The file's column names in order. */
    static List<String> columns(Path file) throws IOException {
        try (ParquetFileReader r = ParquetFileReader.open(new LocalInputFile(file))) {
            return r.getFooter().getFileMetaData().getSchema().getFields().stream().map(Type::getName).toList();
        }
    }

    /** Every row: int64 as Long, double as Double, a string as String. */
    static List<Object[]> read(Path file) throws IOException {
        List<Object[]> rows = new ArrayList<>();
        try (ParquetFileReader r = ParquetFileReader.open(new LocalInputFile(file))) {
            MessageType schema = r.getFooter().getFileMetaData().getSchema();
            PageReadStore pages;
            while ((pages = r.readNextRowGroup()) != null) {
                RecordReader<Group> rr = new ColumnIOFactory().getColumnIO(schema)
                        .getRecordReader(pages, new GroupRecordConverter(schema));
                for (long i = 0; i < pages.getRowCount(); i++) {
                    Group g = rr.read();
                    Object[] row = new Object[schema.getFieldCount()];
                    for (int c = 0; c < row.length; c++) {
                        PrimitiveTypeName t = schema.getType(c).asPrimitiveType().getPrimitiveTypeName();
                        row[c] = switch (t) {
                            case INT64 -> g.getLong(c, 0);
                            case DOUBLE -> g.getDouble(c, 0);
                            default -> g.getString(c, 0);
                        };
                    }
                    rows.add(row);
                }
            }
        }
        return rows;
    }
}
