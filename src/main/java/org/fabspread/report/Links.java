package org.fabspread.report;

import java.util.List;
import java.util.Objects;

/**
 * A list of links to files beside the report, each with the relative path it points to and a plain
 * description. Paths are relative, use '/' and never leave the report's folder.
 */
public record Links(List<Link> links) implements Block {

    public Links {
        links = List.copyOf(Objects.requireNonNull(links, "links"));
        if (links.isEmpty()) {
            throw new IllegalArgumentException("a link list needs at least one link");
        }
    }

    /** One link: a relative path inside the report folder and what the file holds. */
    public record Link(String path, String description) {

        public Link {
            Objects.requireNonNull(path, "path");
            Objects.requireNonNull(description, "description");
            if (path.isBlank() || path.startsWith("/") || path.contains("\\") || path.contains(":")
                    || List.of(path.split("/")).contains("..")) {
                throw new IllegalArgumentException("link path '" + path + "' must be relative and stay in the report folder");
            }
        }
    }
}
