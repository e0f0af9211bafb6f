#include "exports/rank_table.hpp"

#include <cmath>
#include <cstdio>
#include <optional>

#include "exports/csv_text.hpp"
#include "exports/figure_text.hpp"
#include "pattern/combining.hpp"

namespace ellipsa::exports {

std::string outage_text(double outage) {
    char b[32];
    std::snprintf(b, sizeof b, "%g %%", 100 * outage);
    return b;
}

namespace {

const std::string unavailable = "n/a";

// dB of a linear power; -inf for an exact zero (shown "none"), nullopt when unavailable.
std::optional<double> linear_db(const std::optional<double>& v) {
    if (!v || !(*v >= 0)) return std::nullopt;
    return *v > 0 ? to_db(*v) : -INFINITY;
}

std::string cell(const std::optional<double>& db) {
    if (!db) return unavailable;
    return std::isinf(*db) && *db < 0 ? "none" : fixed(*db, db_decimals);  // an exactly zero part
}
std::string signed_cell(const std::optional<double>& db) {
    if (!db) return unavailable;
    std::string s = fixed(std::abs(*db) < 0.005 ? 0.0 : *db, db_decimals);
    if (*db >= 0.005) s.insert(s.begin(), '+');
    return s;
}

// The figures of one table row, in dB (nullopt: unavailable).
struct RowFigures {
    std::optional<double> meg, meg_v, meg_h, median, p10, worst, level, random_level, advantage, random_advantage,
        worst_advantage;
};
RowFigures row_figures(const RankFigures& f) {
    RowFigures r;
    if (f.meg) {
        r.meg = linear_db(f.meg->meg);
        r.meg_v = linear_db(f.meg->meg_vertical);
        r.meg_h = linear_db(f.meg->meg_horizontal);
    }
    if (f.orientations && *f.orientations) {
        const OrientationFigures& o = **f.orientations;
        r.median = linear_db(o.median);
        r.p10 = linear_db(o.random_p10);
        r.worst = linear_db(o.min);
    }
    r.level = linear_db(f.level);
    r.random_level = linear_db(f.random_level);
    r.advantage = f.advantage_db;
    r.random_advantage = f.random_advantage_db;
    r.worst_advantage = f.worst_advantage_db;
    return r;
}

std::string score_name(RankScore s) {
    switch (s) {
        case RankScore::mounted: return "as mounted";
        case RankScore::random: return "random orientation";
        case RankScore::worst: return "worst orientation";
    }
    return "";
}

void ranking_table(Document& doc, const Ranking& r, const RankLabels& l) {
    DocTable t;
    t.header = {"Rank", "Candidate", "File", "Frequency", "Score (dB)"};
    for (const Environment& e : l.environments) t.header.push_back(e.name + " (dB)");
    t.numeric = {true, false, false, true, true};
    t.numeric.resize(t.header.size(), true);
    for (std::size_t k = 0; k < r.rows.size(); ++k) {
        const RankRow& row = r.rows[k];
        std::vector<std::string> c{row.score_db ? std::to_string(k + 1) : "-", l.names[row.input], l.files[row.input],
                                   format_frequency(l.frequencies_hz[row.input]), signed_cell(row.score_db)};
        for (const RankFigures& f : row.environments) c.push_back(signed_cell(score_part_db(f, r.score)));
        t.rows.push_back(c);
    }
    std::vector<std::string> ref{"ref.", l.reference, "", "", signed_cell(0.0)};
    for (std::size_t e = 0; e < l.environments.size(); ++e) ref.push_back(signed_cell(0.0));
    t.rows.push_back(ref);
    doc.table(t);
}

std::vector<std::string> environment_row(const std::string& name, const RowFigures& f, bool orientations) {
    std::vector<std::string> c{name, cell(f.meg), cell(f.meg_v), cell(f.meg_h)};
    if (orientations) {
        c.push_back(cell(f.median));
        c.push_back(cell(f.p10));
        c.push_back(cell(f.worst));
    }
    c.push_back(cell(f.level));
    if (orientations) c.push_back(cell(f.random_level));
    c.push_back(signed_cell(f.advantage));
    return c;
}

void environment_table(Document& doc, const Ranking& r, const RankLabels& l, std::size_t e) {
    const std::string at = outage_text(r.outage);
    DocTable t;
    t.header = {"Candidate", "MEG (dBi)", "V (dBi)", "H (dBi)"};
    if (l.orientations)
        for (const char* h : {"Median (dBi)", "90 % reach (dBi)", "Worst (dBi)"}) t.header.push_back(h);
    t.header.push_back(at + " level (dBi)");
    if (l.orientations) t.header.push_back(at + " random (dBi)");
    t.header.push_back("Advantage (dB)");
    for (const RankRow& row : r.rows)
        t.rows.push_back(environment_row(l.names[row.input], row_figures(row.environments[e]), l.orientations));
    t.rows.push_back(environment_row("reference", row_figures(r.reference[e]), l.orientations));
    doc.table(t);
}

void definitions(Document& doc, const Ranking& r, const RankLabels& l) {
    doc.paragraph("Score: " + score_name(r.score) + ". " + rank_score_definition(r.score) +
                  ". Candidates without a score are listed last (reasons below).");
    doc.paragraph("Reference: " + l.reference + ". Advantage: the candidate's fading level at " + outage_text(r.outage) +
                  " as mounted over the reference's, which in Rayleigh fading equals the MEG ratio.");
    std::string turned = "Orientation statistics: not computed.";
    if (l.orientations) {
        char b[200];
        std::snprintf(b, sizeof b, "tilt 0 to %g° in %g° steps, roll in steps of about %g°, a whole number of each grid's φ steps",
                      l.sweep.tilt_max_deg, l.sweep.tilt_step_deg, l.sweep.roll_step_deg);
        turned = std::string("Orientation statistics over the antenna turned (") + b +
                 "): Median, the median of the turned MEG; 90 % reach, the MEG that 90 % of random orientations reach "
                 "(solid-angle weights); Worst, the lowest. V and H: the vertical and horizontal parts of MEG as mounted. " +
                 outage_text(r.outage) + " random: the " + outage_text(r.outage) +
                 " point of the Rayleigh distributions mixed over those orientations (fading and orientation both random).";
    }
    doc.paragraph(turned);
    doc.paragraph("MEG after Taga (IEEE Trans. VT-39, 1990), each antenna as mounted (world frame, +z up); level at " + outage_text(r.outage) +
                  ": MEG (-ln(1 - p)), " + fixed(-to_db(rayleigh_level(r.outage, 1.0)), db_decimals) +
                  " dB below the mean (Rayleigh fading, one branch).");
}

// What a figure assumes (relative data scaled to directivity: a lossless antenna), once per
// candidate and for the reference: without it a relative file would rank as if it were gain.
void assumption_notes(Document& doc, const Ranking& r, const RankLabels& l) {
    const auto said = [](const std::vector<RankFigures>& figs) -> std::string {
        for (const RankFigures& f : figs)
            if (f.meg && !f.meg->assumption.empty()) return f.meg->assumption;
        return "";
    };
    for (const RankRow& row : r.rows)
        if (std::string a = said(row.environments); !a.empty()) doc.note(l.names[row.input] + ": " + a + ".");
    if (std::string a = said(r.reference); !a.empty()) doc.note("Reference: " + a + ".");
}

}  // namespace

void rank_blocks(Document& doc, const Ranking& r, const RankLabels& l, int level) {
    ranking_table(doc, r, l);
    definitions(doc, r, l);
    for (const RankRow& row : r.rows)
        if (!row.score_db) doc.note(l.names[row.input] + ": no score, " + row.unavailable_reason + ".");
    assumption_notes(doc, r, l);
    for (std::size_t e = 0; e < l.environments.size(); ++e) {
        doc.heading(level, "Environment " + l.environments[e].name);
        doc.paragraph(describe(l.environments[e]) +
                      (l.environments[e].source.empty() ? "" : ". Source: " + l.environments[e].source) + ".");
        environment_table(doc, r, l, e);
    }
    for (const char* c : outage_cautions) doc.note(std::string("Caution: ") + c);
}

namespace {

void csv_row(std::string& o, const std::string& rank, const std::string& file, const std::string& name, double f_hz,
             const std::optional<double>& score, const Environment& env, double outage, const RowFigures& f) {
    append_csv_text(o, rank);
    o += ',';
    append_csv_text(o, file);
    o += ',';
    append_csv_text(o, name);
    o += ',';
    append_csv_number(o, f_hz);
    o += ',';
    append_csv_number(o, score.value_or(NAN));
    o += ',';
    append_csv_text(o, env.name);
    o += ',';
    append_csv_number(o, outage);
    for (const std::optional<double>& v : {f.meg, f.meg_v, f.meg_h, f.median, f.p10, f.worst, f.level, f.random_level,
                                           f.advantage, f.random_advantage, f.worst_advantage}) {
        o += ',';
        append_csv_number(o, v.value_or(NAN));
    }
    o += '\n';
}

}  // namespace

std::string rank_csv(const Ranking& r, const RankLabels& l) {
    std::string o =
        "rank,file,name,frequency_hz,score_db,environment,outage,meg_db,meg_vertical_db,meg_horizontal_db,"
        "orientation_median_db,orientation_p10_db,orientation_worst_db,fading_level_db,fading_level_random_db,"
        "advantage_db,random_advantage_db,worst_advantage_db\n";
    for (std::size_t k = 0; k < r.rows.size(); ++k) {
        const RankRow& row = r.rows[k];
        const std::string rank = row.score_db ? std::to_string(k + 1) : "";
        for (std::size_t e = 0; e < l.environments.size(); ++e)
            csv_row(o, rank, l.files[row.input], l.names[row.input], l.frequencies_hz[row.input], row.score_db,
                    l.environments[e], r.outage, row_figures(row.environments[e]));
    }
    for (std::size_t e = 0; e < l.environments.size(); ++e)
        csv_row(o, "reference", "", l.reference, NAN, 0.0, l.environments[e], r.outage, row_figures(r.reference[e]));
    return o;
}

}  // namespace ellipsa::exports
