package org.fabspread.study;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Sequence;

/** The {@code correlations} list: Spearman rank correlations between pairs of uncertain inputs. */
final class CorrelationsReader extends SectionReader {

    CorrelationsReader(ReadContext ctx) {
        super(ctx);
    }

    List<Correlation> correlations(YamlNode n, String path, Map<String, Parameter> params) {
        Sequence s = list(n, path);
        List<Correlation> out = new ArrayList<>();
        Set<String> pairs = new HashSet<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            Mapping m = mapping(s.items().get(i), p, keys("between", "spearman"));
            String bp = child(p, "between");
            Sequence b = list(req(m, p, "between"), bp);
            if (b.items().size() != 2) {
                throw err(b, bp, "a correlation is between exactly two inputs, got " + b.items().size());
            }
            String a = text(b.items().get(0), bp + "[0]");
            String c = text(b.items().get(1), bp + "[1]");
            input(b.items().get(0), bp + "[0]", a, params);
            input(b.items().get(1), bp + "[1]", c, params);
            if (a.equals(c)) {
                throw err(b.items().get(1), bp + "[1]", "an input cannot be correlated with itself");
            }
            String key = a.compareTo(c) < 0 ? a + "|" + c : c + "|" + a;
            if (!pairs.add(key)) {
                throw err(b, bp, "the pair " + a + ", " + c + " is correlated twice");
            }
            YamlNode rn = req(m, p, "spearman");
            double r = number(rn, child(p, "spearman"), Rule.of("spearman", Quantity.DIMENSIONLESS));
            if (!(r >= -1 && r <= 1)) {
                throw err(rn, child(p, "spearman"), "a rank correlation must lie in [-1, 1], got " + Units.format(r));
            }
            out.add(new Correlation(a, c, r, loc(m, p)));
        }
        return out;
    }
}
