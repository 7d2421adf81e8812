package org.fabspread.plan;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The alias structure of a regular two-level design up to two-factor interactions: for each main
 * effect the two-factor interactions it is aliased with, the chains of aliased two-factor
 * interactions, and the clear effects (aliased with no main effect or two-factor interaction),
 * in the sense of Wu &amp; Chen, Technometrics 34, 162 (1992). Letters A, B, … name factors in
 * design order. Immutable.
 *
 * @param definingRelation  e.g. {@code I = ABCE = BCDF = ADEF}
 * @param resolution        shortest word length ({@link Integer#MAX_VALUE} for a full factorial)
 * @param wordLengthPattern number of words of each length 0..k
 * @param mainEffects       each main effect with its aliases of at most two factors
 * @param interactions      each chain of aliased two-factor interactions, listed once; a chain whose
 *                          first element is a main effect is not repeated here
 * @param clearMainEffects  main effects aliased with no other main effect or two-factor interaction
 * @param clearInteractions two-factor interactions aliased with no main effect or other two-factor interaction
 */
public record AliasStructure(String definingRelation, int resolution, List<Integer> wordLengthPattern,
                             List<AliasChain> mainEffects, List<AliasChain> interactions,
                             List<String> clearMainEffects, List<String> clearInteractions) {

    public AliasStructure {
        wordLengthPattern = List.copyOf(wordLengthPattern);
        mainEffects = List.copyOf(mainEffects);
        interactions = List.copyOf(interactions);
        clearMainEffects = List.copyOf(clearMainEffects);
        clearInteractions = List.copyOf(clearInteractions);
    }

    /** One effect and what it is aliased with (letters). */
    public record AliasChain(String effect, List<String> aliases) {
        public AliasChain {
            aliases = List.copyOf(aliases);
        }

        /** e.g. {@code A + BD + CE}. */
        public String text() {
            StringBuilder b = new StringBuilder(effect);
            for (String a : aliases) {
                b.append(" + ").append(a);
            }
            return b.toString();
        }
    }

    static AliasStructure of(TwoLevelDesign d) {
        int k = d.factors();
        List<AliasChain> mains = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            mains.add(new AliasChain(EffectNames.word(1 << i), words(d.lowOrderAliases(1 << i))));
        }
        List<AliasChain> twos = new ArrayList<>();
        Set<Integer> done = new LinkedHashSet<>();
        for (int i = 0; i < k; i++) {
            for (int j = i + 1; j < k; j++) {
                int e = (1 << i) | (1 << j);
                if (done.contains(e)) {
                    continue;
                }
                List<Integer> al = d.lowOrderAliases(e);
                boolean withMain = al.stream().anyMatch(x -> Integer.bitCount(x) == 1);
                done.add(e);
                done.addAll(al);
                if (!withMain) {
                    twos.add(new AliasChain(EffectNames.word(e), words(al)));
                }
            }
        }
        List<String> clearMain = new ArrayList<>();
        for (int i : d.clearMainEffects()) {
            clearMain.add(EffectNames.word(1 << i));
        }
        List<String> clear2 = new ArrayList<>();
        for (int e : d.clearTwoFactorInteractions()) {
            clear2.add(EffectNames.word(e));
        }
        List<Integer> wlp = new ArrayList<>();
        for (int a : d.wordLengthPattern()) {
            wlp.add(a);
        }
        return new AliasStructure(d.definingRelation(), d.resolution(), wlp, mains, twos, clearMain, clear2);
    }

    private static List<String> words(List<Integer> masks) {
        List<String> out = new ArrayList<>();
        for (int m : masks) {
            out.add(EffectNames.word(m));
        }
        return out;
    }

    /** Plain-text listing, with factor letters explained by {@code ids} when given. */
    public String text(List<String> ids) {
        StringBuilder b = new StringBuilder();
        if (ids != null) {
            for (int i = 0; i < ids.size(); i++) {
                b.append("  ").append(EffectNames.letter(i)).append(" = ").append(ids.get(i)).append('\n');
            }
        }
        b.append("Defining relation: ").append(definingRelation).append('\n');
        b.append("Resolution: ").append(TwoLevelDesign.resolutionLabel(resolution)).append('\n');
        b.append("Word-length pattern (A3, A4, ...): ")
                .append(wordLengthPattern.subList(Math.min(3, wordLengthPattern.size()), wordLengthPattern.size()))
                .append('\n');
        b.append("Main effects (aliases up to two-factor interactions):\n");
        for (AliasChain c : mainEffects) {
            b.append("  ").append(c.text()).append('\n');
        }
        b.append("Two-factor interaction chains:\n");
        for (AliasChain c : interactions) {
            b.append("  ").append(c.text()).append('\n');
        }
        b.append("Clear main effects: ").append(clearMainEffects.isEmpty() ? "none" : String.join(" ", clearMainEffects))
                .append('\n');
        b.append("Clear two-factor interactions: ")
                .append(clearInteractions.isEmpty() ? "none" : String.join(" ", clearInteractions)).append('\n');
        return b.toString();
    }
}
