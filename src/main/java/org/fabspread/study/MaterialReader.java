package org.fabspread.study;

import java.nio.file.Path;
import java.util.List;

import org.fabspread.study.YamlNode.Mapping;

/**
 * A material named by a layer or the particles: a bundled table id or {@code {file: table.csv}}
 * (an n,k table beside the study). Records the tabulated range for the wavelength-grid check.
 */
final class MaterialReader extends SectionReader {

    MaterialReader(ReadContext ctx) {
        super(ctx);
    }

    MaterialRef material(YamlNode n, String path, String usedBy) {
        if (n instanceof Mapping) {
            Mapping m = mapping(n, path, keys("file"));
            YamlNode fn = req(m, path, "file");
            String fp = child(path, "file");
            Path csv = existing(fn, fp);
            String id = csv.getFileName().toString().replaceFirst("\\.[^.]*$", "");
            double[] range;
            try {
                range = ctx.catalog().rangeOfFile(csv);
            } catch (StudyException e) {
                throw err(fn, fp, e.getMessage());
            }
            ctx.materialUses().add(new ReadContext.MaterialUse(id, usedBy, range));
            return new MaterialRef(id, csv);
        }
        String id = text(n, path);
        if (!ctx.catalog().has(id)) {
            List<String> close = Suggestions.close(id, ctx.catalog().ids(), 4);
            throw err(n, path, "unknown material '" + id + "'; " + (close.isEmpty()
                    ? "bundled materials: " + String.join(", ", ctx.catalog().ids())
                    : "close matches: " + String.join(", ", close)) + " (or give {file: table.csv})");
        }
        ctx.materialUses().add(new ReadContext.MaterialUse(id, usedBy, ctx.catalog().range(id)));
        return MaterialRef.bundled(id);
    }
}
