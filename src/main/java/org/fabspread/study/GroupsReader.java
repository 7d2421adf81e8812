package org.fabspread.study;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.fabspread.study.YamlNode.Mapping;

/**
 * {@code analysis.groups}: named sets of uncertain inputs whose variance contributions are reported
 * together, e.g. {@code particle process: [particles.diameter, particles.size_cv, particles.coverage]}.
 */
final class GroupsReader extends SectionReader {

    GroupsReader(ReadContext ctx) {
        super(ctx);
    }

    List<AnalysisSettings.Group> groups(YamlNode n, String path, Map<String, Parameter> params) {
        if (!(n instanceof Mapping m)) {
            throw err(n, path, "expected group names, each with a list of inputs, got " + n.kindName());
        }
        List<AnalysisSettings.Group> out = new ArrayList<>();
        for (YamlNode.Entry e : m.entries().values()) {
            String name = e.key().name();
            String p = child(path, name);
            YamlNode.Sequence s = list(e.value(), p);
            if (s.items().isEmpty()) {
                throw err(e.value(), p, "a group needs at least one input");
            }
            Set<String> seen = new HashSet<>();
            List<String> ids = new ArrayList<>();
            for (int i = 0; i < s.items().size(); i++) {
                YamlNode item = s.items().get(i);
                String ip = p + "[" + i + "]";
                String id = text(item, ip);
                input(item, ip, id, params);
                if (!seen.add(id)) {
                    throw err(item, ip, "'" + id + "' is named twice in the group");
                }
                ids.add(id);
            }
            out.add(new AnalysisSettings.Group(name, ids, loc(e.value(), p)));
        }
        return out;
    }
}
