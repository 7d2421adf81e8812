package org.fabspread.plan;

import java.util.List;

/**
 * Letters for the factors of a two-level design (A, B, …, H, J, K, L: I is skipped because it
 * stands for the identity in a defining relation) and names of effects given as bit masks.
 */
public final class EffectNames {

    /** The letters, in factor order. */
    public static final String LETTERS = "ABCDEFGHJKLMNOPQRSTUVWXYZ";

    private EffectNames() {
    }

    /** The letter of factor i. */
    public static char letter(int i) {
        return LETTERS.charAt(i);
    }

    /** Factor index of a letter, or -1. */
    public static int index(char c) {
        return LETTERS.indexOf(Character.toUpperCase(c));
    }

    /** The word of a factor mask, e.g. bits 0,1,3 give {@code ABD}; the empty mask gives {@code I}. */
    public static String word(int mask) {
        if (mask == 0) {
            return "I";
        }
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < 31; i++) {
            if ((mask & (1 << i)) != 0) {
                b.append(letter(i));
            }
        }
        return b.toString();
    }

    /** The mask of a word such as {@code ABD}. */
    public static int mask(String word) {
        int m = 0;
        for (char c : word.toCharArray()) {
            int i = index(c);
            if (i < 0) {
                throw new IllegalArgumentException("not a factor letter: " + c + " in " + word);
            }
            m ^= 1 << i;
        }
        return m;
    }

    /** An effect named by factor ids, e.g. {@code stack.etl.thickness × particles.coverage}. */
    public static String named(int mask, List<String> ids) {
        if (mask == 0) {
            return "mean";
        }
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < ids.size(); i++) {
            if ((mask & (1 << i)) != 0) {
                if (b.length() > 0) {
                    b.append(" x ");
                }
                b.append(ids.get(i));
            }
        }
        return b.toString();
    }
}
