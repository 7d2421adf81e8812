package org.fabspread.sampling;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

import com.fasterxml.jackson.annotation.JsonIgnore;
import com.fasterxml.jackson.annotation.JsonIgnoreType;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.MapperFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.module.SimpleModule;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;

import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;

/**
 * A fingerprint of what a run computes: SHA-256 over the parsed study (every record field, values
 * of measured distributions included; source locations and folders left out, so moving the study
 * folder or editing comments does not change it) and the model's class, inputs and outputs.
 * A checkpoint only resumes a run with the same fingerprint.
 */
public final class StudyDigest {

    @JsonIgnoreType
    private abstract static class IgnoreType {
    }

    private abstract static class StudyMixin {
        @JsonIgnore
        abstract Path file();
    }

    private static final class FileNameSerializer extends StdSerializer<Path> {
        FileNameSerializer() {
            super(Path.class);
        }

        @Override
        public void serialize(Path value, JsonGenerator gen, SerializerProvider provider) throws IOException {
            gen.writeString(value.getFileName() == null ? "" : value.getFileName().toString());
        }
    }

    private static final ObjectMapper JSON = JsonMapper.builder()
            .configure(MapperFeature.SORT_PROPERTIES_ALPHABETICALLY, true)
            .addMixIn(SourceLocation.class, IgnoreType.class)
            .addMixIn(Study.class, StudyMixin.class)
            .addModule(new SimpleModule().addSerializer(Path.class, new FileNameSerializer()))
            .build();

    private StudyDigest() {
    }

    public static String of(Study study, Model model) {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            md.update(JSON.writeValueAsBytes(study));
            StringBuilder sb = new StringBuilder("\nmodel ").append(model.getClass().getName());
            sb.append("\ninputs ").append(String.join(",", model.inputIds())).append("\noutputs");
            for (OutputDef o : model.outputs()) {
                sb.append(' ').append(o.id());
            }
            md.update(sb.toString().getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(md.digest());
        } catch (NoSuchAlgorithmException | IOException e) {
            throw new IllegalStateException("cannot fingerprint the study", e);
        }
    }
}
