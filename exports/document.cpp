#include "exports/document.hpp"

#include <algorithm>
#include <cctype>

namespace ellipsa::exports {

void Document::heading(int level, std::string text, std::string anchor) {
    DocBlock b;
    b.kind = DocBlock::Kind::heading;
    b.level = level;
    b.text = std::move(text);
    b.anchor = std::move(anchor);
    blocks.push_back(std::move(b));
}
void Document::paragraph(std::string text) {
    DocBlock b;
    b.kind = DocBlock::Kind::paragraph;
    b.text = std::move(text);
    blocks.push_back(std::move(b));
}
void Document::note(std::string text) {
    DocBlock b;
    b.kind = DocBlock::Kind::note;
    b.text = std::move(text);
    blocks.push_back(std::move(b));
}
void Document::table(DocTable t) {
    DocBlock b;
    b.kind = DocBlock::Kind::table;
    b.table = std::move(t);
    blocks.push_back(std::move(b));
}
void Document::figures(std::vector<DocFigure> f) {
    DocBlock b;
    b.kind = DocBlock::Kind::figures;
    b.figures = std::move(f);
    blocks.push_back(std::move(b));
}

std::string html_escape(const std::string& s) {
    std::string o;
    o.reserve(s.size());
    for (char c : s) {
        switch (c) {
            case '&': o += "&amp;"; break;
            case '<': o += "&lt;"; break;
            case '>': o += "&gt;"; break;
            case '"': o += "&quot;"; break;
            default: o += c;
        }
    }
    return o;
}

std::string markdown_escape_cell(const std::string& s) {
    std::string o;
    for (char c : s) {
        if (c == '|' || c == '\\' || c == '*' || c == '_' || c == '`' || c == '[' || c == ']' || c == '<') o += '\\';
        if (c == '\n') {
            o += ' ';
            continue;
        }
        o += c;
    }
    return o;
}

namespace {

// File names in the folder are plain; still, keep them safe in URLs and Markdown links.
std::string url(const std::string& f) {
    std::string o;
    for (unsigned char c : f) {
        if (std::isalnum(c) || c == '.' || c == '-' || c == '_') {
            o += char(c);
        } else {
            static const char* hex = "0123456789ABCDEF";
            o += '%';
            o += hex[c >> 4];
            o += hex[c & 15];
        }
    }
    return o;
}

bool is_numeric_col(const DocTable& t, std::size_t i) { return i < t.numeric.size() ? t.numeric[i] : i > 0; }

const char* kStyle = R"(
:root { --ink:#1a1a1a; --soft:#555; --rule:#d0d0d0; --band:#f4f4f4; --accent:#0072b2; }
* { box-sizing: border-box; }
body { font-family: "DejaVu Sans", "Helvetica Neue", Arial, sans-serif; color: var(--ink); margin: 0;
       line-height: 1.45; font-size: 15px; background: #fff; }
main { max-width: 1100px; margin: 0 auto; padding: 28px 32px 60px; }
h1 { font-size: 26px; margin: 0 0 6px; }
h2 { font-size: 20px; margin: 36px 0 10px; padding-bottom: 4px; border-bottom: 2px solid var(--accent); }
h3 { font-size: 16.5px; margin: 26px 0 8px; }
h4 { font-size: 15px; margin: 18px 0 6px; color: var(--soft); }
p { margin: 6px 0 10px; }
p.note { color: var(--soft); font-size: 13px; }
table { border-collapse: collapse; margin: 8px 0 16px; font-size: 14px; }
th, td { padding: 5px 12px; border-bottom: 1px solid var(--rule); text-align: left; vertical-align: top; }
th { background: var(--band); border-bottom: 2px solid #999; font-weight: 600; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
tr:hover td { background: #fafafa; }
.figs { display: grid; grid-template-columns: repeat(auto-fill, minmax(560px, 1fr)); gap: 18px; margin: 10px 0 20px; }
figure { margin: 0; border: 1px solid var(--rule); padding: 6px; background: #fff; }
figure img { width: 100%; height: auto; display: block; }
figcaption { font-size: 13px; color: var(--soft); padding: 6px 2px 0; }
figcaption a { color: var(--accent); }
@media print { main { max-width: none; padding: 0; } .figs { grid-template-columns: 1fr 1fr; }
               figure { break-inside: avoid; } h2 { break-after: avoid; } }
)";

}  // namespace

std::string to_html(const Document& d) {
    std::string o = "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n";
    o += "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n";
    o += "<title>" + html_escape(d.title) + "</title>\n<style>" + std::string(kStyle) + "</style>\n</head>\n<body>\n<main>\n";
    o += "<h1>" + html_escape(d.title) + "</h1>\n";
    for (const DocBlock& b : d.blocks) {
        switch (b.kind) {
            case DocBlock::Kind::heading: {
                const std::string h = "h" + std::to_string(b.level < 1 ? 1 : b.level > 4 ? 4 : b.level);
                o += "<" + h + (b.anchor.empty() ? "" : " id=\"" + html_escape(b.anchor) + "\"") + ">" + html_escape(b.text) +
                     "</" + h + ">\n";
                break;
            }
            case DocBlock::Kind::paragraph: o += "<p>" + html_escape(b.text) + "</p>\n"; break;
            case DocBlock::Kind::note: o += "<p class=\"note\">" + html_escape(b.text) + "</p>\n"; break;
            case DocBlock::Kind::table: {
                const DocTable& t = b.table;
                o += "<table>\n<thead><tr>";
                for (std::size_t i = 0; i < t.header.size(); ++i)
                    o += std::string("<th") + (is_numeric_col(t, i) ? " class=\"num\"" : "") + ">" + html_escape(t.header[i]) +
                         "</th>";
                o += "</tr></thead>\n<tbody>\n";
                for (const auto& row : t.rows) {
                    o += "<tr>";
                    for (std::size_t i = 0; i < row.size(); ++i)
                        o += std::string("<td") + (is_numeric_col(t, i) ? " class=\"num\"" : "") + ">" + html_escape(row[i]) +
                             "</td>";
                    o += "</tr>\n";
                }
                o += "</tbody>\n</table>\n";
                break;
            }
            case DocBlock::Kind::figures: {
                o += "<div class=\"figs\">\n";
                for (const DocFigure& f : b.figures) {
                    const std::string shown = f.vector_file.empty() ? f.raster_file : f.vector_file;
                    o += "<figure><img src=\"" + url(shown) + "\" alt=\"" + html_escape(f.alt.empty() ? f.caption : f.alt) +
                         "\"/><figcaption>" + html_escape(f.caption);
                    if (!f.vector_file.empty()) o += " · <a href=\"" + url(f.vector_file) + "\">SVG</a>";
                    if (!f.raster_file.empty()) o += " · <a href=\"" + url(f.raster_file) + "\">PNG</a>";
                    o += "</figcaption></figure>\n";
                }
                o += "</div>\n";
                break;
            }
        }
    }
    o += "</main>\n</body>\n</html>\n";
    return o;
}

std::string to_markdown(const Document& d) {
    std::string o = "# " + markdown_escape_cell(d.title) + "\n\n";
    for (const DocBlock& b : d.blocks) {
        switch (b.kind) {
            case DocBlock::Kind::heading:
                if (b.level <= 1) break;  // the title is the one level-1 heading
                o.append(std::size_t(b.level), '#').append(" ").append(markdown_escape_cell(b.text)).append("\n\n");
                break;
            case DocBlock::Kind::paragraph: o.append(markdown_escape_cell(b.text)).append("\n\n"); break;
            case DocBlock::Kind::note:
                o.append("*").append(markdown_escape_cell(b.text)).append("*\n\n");
                break;
            case DocBlock::Kind::table: {
                const DocTable& t = b.table;
                o += "|";
                for (const auto& h : t.header) o.append(" ").append(markdown_escape_cell(h)).append(" |");
                o += "\n|";
                for (std::size_t i = 0; i < t.header.size(); ++i) o += is_numeric_col(t, i) ? " ---: |" : " --- |";
                o += "\n";
                for (const auto& row : t.rows) {
                    o += "|";
                    for (const auto& c : row) o.append(" ").append(markdown_escape_cell(c)).append(" |");
                    o += "\n";
                }
                o += "\n";
                break;
            }
            case DocBlock::Kind::figures:
                for (const DocFigure& f : b.figures) {
                    const std::string shown = f.raster_file.empty() ? f.vector_file : f.raster_file;
                    o += "![" + markdown_escape_cell(f.alt.empty() ? f.caption : f.alt) + "](" + url(shown) + ")\n\n";
                    o.append("*").append(markdown_escape_cell(f.caption)).append("*");
                    if (!f.vector_file.empty()) o += " ([SVG](" + url(f.vector_file) + "))";
                    o += "\n\n";
                }
                break;
        }
    }
    return o;
}

namespace {
std::size_t text_width(const std::string& s) {
    std::size_t n = 0;
    for (unsigned char c : s) n += (c & 0xC0) != 0x80;
    return n;
}
}  // namespace

std::string to_text(const DocTable& t) {
    std::vector<std::size_t> w(t.header.size(), 0);
    for (std::size_t i = 0; i < t.header.size(); ++i) w[i] = text_width(t.header[i]);
    for (const auto& row : t.rows)
        for (std::size_t i = 0; i < row.size() && i < w.size(); ++i) w[i] = std::max(w[i], text_width(row[i]));
    auto line = [&](const std::vector<std::string>& cells) {
        std::string o;
        for (std::size_t i = 0; i < w.size(); ++i) {
            const std::string c = i < cells.size() ? cells[i] : std::string();
            const std::string pad(w[i] - text_width(c), ' ');
            o += (i ? "  " : "") + (is_numeric_col(t, i) ? pad + c : c + (i + 1 < w.size() ? pad : ""));
        }
        while (!o.empty() && o.back() == ' ') o.pop_back();
        return o + "\n";
    };
    std::string o = line(t.header);
    std::vector<std::string> rule;
    for (std::size_t n : w) rule.push_back(std::string(n, '-'));
    o += line(rule);
    for (const auto& row : t.rows) o += line(row);
    return o;
}

std::string to_text(const Document& d) {
    std::string o = d.title.empty() ? "" : d.title + "\n";
    for (const DocBlock& b : d.blocks) {
        switch (b.kind) {
            case DocBlock::Kind::heading: o += "\n" + b.text + "\n"; break;
            case DocBlock::Kind::paragraph:
            case DocBlock::Kind::note: o += b.text + "\n"; break;
            case DocBlock::Kind::table: o += to_text(b.table); break;
            case DocBlock::Kind::figures:
                for (const DocFigure& f : b.figures)
                    o += "figure: " + f.caption + " (" + (f.vector_file.empty() ? f.raster_file : f.vector_file) + ")\n";
                break;
        }
    }
    return o;
}

}  // namespace ellipsa::exports
