package org.fabspread.study;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;

/**
 * Reads a YAML file with Jackson's streaming YAML parser into a {@link YamlNode} tree that keeps the
 * line and column of every key and value. Duplicate keys are an error (YAML forbids them, and a
 * silently overwritten tolerance is a bad surprise).
 */
final class YamlTree {
    private static final YAMLFactory FACTORY = new YAMLFactory();

    private YamlTree() {
    }

    /** Parses a whole file; errors are one line naming file, line and column. */
    static YamlNode parse(Path file) {
        String name = file.getFileName().toString();
        if (!Files.exists(file)) {
            throw new StudyException(file + ": study file not found");
        }
        String text;
        try {
            text = TextFiles.read(file);
        } catch (StudyException e) {
            throw new StudyException(e.getMessage().replace(": the file is", ": the study file is"));
        }
        try (Reader r = new StringReader(text);
             JsonParser p = FACTORY.createParser(r)) {
            JsonToken t = p.nextToken();
            if (t == null) {
                throw new StudyException(name + ": the study file is empty");
            }
            return read(p, name, "");
        } catch (JsonProcessingException e) {
            throw syntax(name, e);
        } catch (IOException e) {
            throw new StudyException(file + ": cannot read the study file: " + e.getMessage());
        }
    }

    /** One line for a YAML syntax error: the parser's problem and its position, in plain words where we can. */
    private static StudyException syntax(String name, JsonProcessingException e) {
        JsonLocation l = e.getLocation();
        int line = l == null ? 0 : l.getLineNr();
        int col = l == null ? 0 : l.getColumnNr();
        String msg = e.getOriginalMessage() == null ? "unreadable YAML" : e.getOriginalMessage();
        if (e.getCause() instanceof org.yaml.snakeyaml.error.MarkedYAMLException m) {
            msg = m.getProblem() == null ? msg : m.getProblem();
            if (m.getProblemMark() != null) {
                line = m.getProblemMark().getLine() + 1;
                col = m.getProblemMark().getColumn() + 1;
            }
        }
        msg = msg.strip().replaceAll("\\s*\\R\\s*", " ");
        if (msg.contains("<block end>") || msg.contains("<block mapping start>")) {
            msg = "this line is not lined up with the keys around it (check its indentation)";
        } else if (msg.contains("mapping values are not allowed")) {
            msg = "unexpected ':' (put text containing ': ' in quotes, or check the indentation)";
        }
        String where = line <= 0 ? name : name + ":" + line + ":" + col;
        return new StudyException(where + ": not valid YAML: " + msg);
    }

    private static YamlNode read(JsonParser p, String name, String path) throws IOException {
        JsonLocation loc = p.currentTokenLocation();
        int line = loc.getLineNr();
        int col = loc.getColumnNr();
        JsonToken t = p.currentToken();
        switch (t) {
            case START_OBJECT: {
                Map<String, YamlNode.Entry> entries = new LinkedHashMap<>();
                while (p.nextToken() == JsonToken.FIELD_NAME) {
                    JsonLocation kl = p.currentTokenLocation();
                    String key = p.currentName();
                    YamlNode.Key k = new YamlNode.Key(key, kl.getLineNr(), kl.getColumnNr());
                    p.nextToken();
                    String keyPath = path.isEmpty() ? key : path + "." + key;
                    YamlNode value = read(p, name, keyPath);
                    if (entries.containsKey(key)) {
                        YamlNode.Key first = entries.get(key).key();
                        throw new StudyException(name + ":" + k.line() + ":" + k.column() + ": " + keyPath
                                + ": duplicate key (first given on line " + first.line() + ")");
                    }
                    entries.put(key, new YamlNode.Entry(k, value));
                }
                return new YamlNode.Mapping(entries, line, col);
            }
            case START_ARRAY: {
                List<YamlNode> items = new ArrayList<>();
                while (p.nextToken() != JsonToken.END_ARRAY) {
                    items.add(read(p, name, path + "[" + items.size() + "]"));
                }
                return new YamlNode.Sequence(items, line, col);
            }
            case VALUE_STRING:
                return new YamlNode.Scalar(p.getText(), YamlNode.Scalar.Type.STRING, line, col);
            case VALUE_NUMBER_INT:
            case VALUE_NUMBER_FLOAT:
                return new YamlNode.Scalar(p.getText(), YamlNode.Scalar.Type.NUMBER, line, col);
            case VALUE_TRUE:
            case VALUE_FALSE:
                return new YamlNode.Scalar(p.getText(), YamlNode.Scalar.Type.BOOLEAN, line, col);
            case VALUE_NULL:
                return new YamlNode.Scalar("", YamlNode.Scalar.Type.NULL, line, col);
            default:
                throw new StudyException(name + ":" + line + ":" + col + ": unsupported YAML content (" + t + ")");
        }
    }
}
