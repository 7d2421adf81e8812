package org.fabspread.report;

/**
 * One piece of a report section. All strings are plain text (never markup): the renderers escape
 * them for HTML and Markdown.
 */
public sealed interface Block permits Paragraph, Caution, KeyValues, Table, Figure, Preformatted, BulletList, Links {
}
