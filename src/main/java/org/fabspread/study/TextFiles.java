package org.fabspread.study;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Every text file the program reads (the study, n,k tables, measured values, enhancement tables, run
 * sheets) goes through {@link #read}: UTF-8 with or without a byte-order mark, any line ends (CRLF,
 * LF, CR) given back as LF. Anything else is one plain line, e.g. {@code wafers.csv: the file is not
 * UTF-8 text (it looks like UTF-16; save it as UTF-8)} — never a Java exception name.
 */
public final class TextFiles {

    private static final char BOM = '\uFEFF';

    private TextFiles() {
    }

    /**
     * The text of {@code file}, decoded strictly as UTF-8, without a leading byte-order mark and with
     * LF line ends.
     *
     * @throws StudyException naming the file (by its name only) when it is missing, larger than
     *                        {@link Limits#MAX_DATA_FILE_BYTES}, unreadable or not UTF-8 text
     */
    public static String read(Path file) {
        String name = file.getFileName() == null ? file.toString() : file.getFileName().toString();
        byte[] bytes;
        try {
            if (Files.isRegularFile(file) && Files.size(file) > Limits.MAX_DATA_FILE_BYTES) {
                throw new StudyException(name + ": the file is larger than " + (Limits.MAX_DATA_FILE_BYTES >> 20)
                        + " MB; a study's files are tables of at most a few thousand rows");
            }
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new StudyException(name + ": file not found");
        } catch (IOException e) {
            throw new StudyException(name + ": cannot read the file (" + Printable.excerpt(
                    e.getMessage() == null ? "input/output error" : e.getMessage()) + ")");
        }
        return decode(name, bytes);
    }

    /** {@link #read} as a {@link Reader}. */
    public static Reader reader(Path file) {
        return new StringReader(read(file));
    }

    /** Decodes bytes as {@link #read} does; {@code name} names the source in the error. */
    public static String decode(String name, byte[] bytes) {
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new StudyException(name + ": the file is not UTF-8 text" + guess(bytes) + "; save it as UTF-8");
        }
        if (!text.isEmpty() && text.charAt(0) == BOM) {
            text = text.substring(1);
        }
        if (text.indexOf('\0') >= 0) {
            throw new StudyException(name + ": the file is not UTF-8 text" + guess(bytes) + "; save it as UTF-8");
        }
        return text.indexOf('\r') < 0 ? text : text.replace("\r\n", "\n").replace('\r', '\n');
    }

    /** A hint at what the bytes are: UTF-16 (byte-order mark or zero bytes) or a single-byte code page. */
    private static String guess(byte[] b) {
        if (b.length >= 2 && ((b[0] == (byte) 0xFF && b[1] == (byte) 0xFE) || (b[0] == (byte) 0xFE && b[1] == (byte) 0xFF))) {
            return " (it is UTF-16)";
        }
        for (byte x : b) {
            if (x == 0) {
                return " (it looks like UTF-16 or a binary file)";
            }
        }
        return " (it looks like Latin-1 or Windows-1252)";
    }
}
