// A small document model for reports, written out as HTML and as Markdown from the same blocks,
// so the two files always hold the same content. Figures refer to image files in the same
// folder; nothing refers to the network.
#pragma once
#include <string>
#include <vector>

namespace ellipsa::exports {

struct DocTable {
    std::vector<std::string> header;
    std::vector<std::vector<std::string>> rows;
    std::vector<bool> numeric;  // per column: right-aligned (default: all but the first)
};

struct DocFigure {
    std::string caption;
    std::string vector_file;  // SVG shown in HTML (may be empty)
    std::string raster_file;  // PNG shown in Markdown and linked from HTML
    std::string alt;
};

struct DocBlock {
    enum class Kind { heading, paragraph, note, table, figures } kind = Kind::paragraph;
    int level = 2;          // heading: 1..4
    std::string text;       // heading, paragraph or note text (plain; escaped on output)
    std::string anchor;     // heading: id for links (optional)
    DocTable table;
    std::vector<DocFigure> figures;
};

struct Document {
    std::string title;
    std::vector<DocBlock> blocks;

    void heading(int level, std::string text, std::string anchor = {});
    void paragraph(std::string text);
    void note(std::string text);  // small print
    void table(DocTable t);
    void figures(std::vector<DocFigure> f);
};

// A complete HTML page with its styles inline (no scripts, fonts or images from elsewhere).
std::string to_html(const Document& d);
// GitHub-flavoured Markdown (pipe tables, image links).
std::string to_markdown(const Document& d);

// Plain text for a terminal: headings and paragraphs as lines, tables in aligned columns (numeric
// columns right-aligned, widths counted in UTF-8 characters), figures by caption and file.
std::string to_text(const Document& d);
std::string to_text(const DocTable& t);

// Escaping helpers (exposed for tests).
std::string html_escape(const std::string& s);
std::string markdown_escape_cell(const std::string& s);

}  // namespace ellipsa::exports
