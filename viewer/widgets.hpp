// Small widgets the panels share: a "(?)" help marker, a label/value table row, and the line
// that reports an export (with the offer to replace a file that is already there).
#pragma once
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "viewer/state/app_state.hpp"
#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

void help_marker(const char* text);
// Text broken into lines of at most `width` (as `measure` gives it) at spaces and newlines only:
// ImGui's own wrapping also breaks after '.' and ',', which split "9.47 dB" inside the number. A
// word wider than the line stays whole on its own line.
std::vector<std::string> word_lines(const std::string& text, float width, const std::function<float(const std::string&)>& measure);
// The text wrapped with word_lines() to the space left on the line (muted when `disabled`).
void text_wrapped_at_spaces(const std::string& text, bool disabled = false);
// `text` as it fits in `width` pixels of the current font: whole, or its start and its end with
// "\u2026" between (the end gets two thirds of the room: file names differ most at their end, as
// "patch_rev_B_2450MHz"), cut between UTF-8 characters.
std::string elide_middle(const std::string& text, float width);
// A two-column table of labels (as wide as the widest) and values (the rest, wrapped). End it
// with ImGui::EndTable() when it returns true.
bool begin_figure_table(const char* id, bool row_bg = false);
// One row of a two-column table: a muted label (with a tooltip when given) and the value, wrapped.
void table_row(const char* label, const std::string& value, const char* tip = nullptr);
// "Wrote ...", "Export failed: ...", or "... is already there. [Replace it] [Keep it]".
Intents export_outcome_line(const std::optional<ExportOutcome>& outcome, ExportTarget target);
// "1.23 dBi"; a zero field as "none (zero field)" (exports::level_text), anything else not finite as "n/a".
std::string db_text(double value_db, const std::string& unit);

}  // namespace ellipsa::viewer
