package org.fabspread.pipeline;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/** Version, commit and build date, filtered into the jar by Maven. */
public final class BuildInfo {
    private static final Properties P = new Properties();

    static {
        try (InputStream in = BuildInfo.class.getResourceAsStream("/org/fabspread/build.properties")) {
            if (in != null) {
                P.load(in);
            }
        } catch (IOException ignored) {
            // leave the defaults below
        }
    }

    private BuildInfo() {
    }

    public static String version() {
        return clean(P.getProperty("version"), "dev");
    }

    public static String commit() {
        return clean(P.getProperty("commit"), "unknown");
    }

    public static String date() {
        return clean(P.getProperty("date"), "unknown");
    }

    private static String clean(String v, String dflt) {
        return v == null || v.isBlank() || v.startsWith("${") ? dflt : v;
    }
}
