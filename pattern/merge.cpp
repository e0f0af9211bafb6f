#include "pattern/merge.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace ellipsa {

namespace {

Error fail(const std::string& msg) { return Error{"", 0, 0, msg}; }

std::string num(double x) {
    char b[32];
    std::snprintf(b, sizeof b, "%g", x);
    return b;
}

// True when v is a sample of the axis (phi taken modulo 360).
bool on_axis(const AngleAxis& a, double v, bool modulo) {
    double u = (modulo ? wrap360(v - a.start_deg) : v - a.start_deg) / a.step_deg;
    if (modulo && std::abs(u - 360.0 / a.step_deg) < 1e-6) u = 0;
    const double k = std::round(u);
    return std::abs(u - k) < 1e-6 && k >= 0 && k < a.count;
}

// The first direction that a samples and b does not, as text; empty when there is none.
std::string first_missing(const Grid& a, const Grid& b) {
    for (int i = 0; i < a.theta.count; ++i)
        if (!on_axis(b.theta, a.theta.value_deg(i), false))
            return "theta " + num(a.theta.value_deg(i)) + ", phi " + num(a.phi.start_deg) + " deg";
    for (int j = 0; j < a.phi.count; ++j)
        if (!on_axis(b.phi, a.phi.value_deg(j), true))
            return "theta " + num(a.theta.start_deg) + ", phi " + num(a.phi.value_deg(j)) + " deg";
    return "";
}

Status same_grids(const NamedSet& a, const NamedSet& b) {
    const Grid &ga = a.set.grid, &gb = b.set.grid;
    const std::string both = a.name + " and " + b.name + ": expected the same grid";
    if (ga.sampling != gb.sampling)
        return fail(both + ", found " + to_string(ga.sampling) + " and " + to_string(gb.sampling) + " sampling");
    if (same_grid(ga, gb)) return Ok{};
    if (std::string d = first_missing(ga, gb); !d.empty())
        return fail(both + "; the first direction of " + a.name + " that " + b.name + " lacks: " + d);
    if (std::string d = first_missing(gb, ga); !d.empty())
        return fail(both + "; the first direction of " + b.name + " that " + a.name + " lacks: " + d);
    return fail(both + ", found other steps over the same range");
}

bool same_mounting_declared(const Mounting& a, const Mounting& b) {
    if (a.up.x != b.up.x || a.up.y != b.up.y || a.up.z != b.up.z || a.turns.size() != b.turns.size()) return false;
    for (std::size_t i = 0; i < a.turns.size(); ++i)
        if (a.turns[i].axis != b.turns[i].axis || a.turns[i].angle_deg != b.turns[i].angle_deg) return false;
    return true;
}

Status same_kind(const NamedSet& a, const NamedSet& b) {
    const std::string both = a.name + " and " + b.name + ": expected the same ";
    if (a.set.quantity != b.set.quantity)
        return fail(both + "quantity, found " + to_string(a.set.quantity) + " and " + to_string(b.set.quantity));
    if (a.set.content != b.set.content)
        return fail(both + "kind of data, found " + to_string(a.set.content) + " and " + to_string(b.set.content));
    if (!same_mounting_declared(a.set.file_mounting, b.set.file_mounting))
        return fail(both + "mounting (mounting-up, mounting-turns), found two");
    if (a.set.ludwig3_reference != b.set.ludwig3_reference &&
        (a.set.part == FieldPart::co || a.set.part == FieldPart::cross))
        return fail(both + "ludwig3-reference for the co- and cross-polar parts, found two");
    return Ok{};
}

std::string frequency_words(double hz) { return hz > 0 ? format_frequency(hz) : "an unknown frequency"; }

// The sets of one part as one multi-frequency set, sorted by frequency, each frequency once.
Result<FarFieldSet> by_frequency(std::vector<NamedSet*> group) {
    struct Item {
        double hz;
        NamedSet* from;
        std::size_t k;
    };
    std::vector<Item> items;
    for (NamedSet* n : group)
        for (std::size_t k = 0; k < n->set.frequencies.size(); ++k)
            items.push_back({n->set.frequencies[k].frequency_hz, n, k});
    std::stable_sort(items.begin(), items.end(), [](const Item& x, const Item& y) { return x.hz < y.hz; });
    for (std::size_t i = 1; i < items.size(); ++i)
        if (std::abs(items[i].hz - items[i - 1].hz) <= 1e-9 * std::max(1.0, items[i].hz))
            return fail(items[i - 1].from->name + " and " + items[i].from->name + ": expected distinct frequencies, found " +
                        frequency_words(items[i].hz) + " in both" +
                        (items[i].hz > 0 ? std::string("") : " (give each file its own: FILE::assume=frequency=...)"));
    FarFieldSet out = group[0]->set;  // metadata of the first; fields replaced below
    out.frequencies.clear();
    for (const Item& it : items) out.frequencies.push_back(std::move(it.from->set.frequencies[it.k]));
    return out;
}

bool pair_of_one_basis(FieldPart a, FieldPart b) {
    auto is = [&](FieldPart x, FieldPart y) { return (a == x && b == y) || (a == y && b == x); };
    return is(FieldPart::theta, FieldPart::phi) || is(FieldPart::rhcp, FieldPart::lhcp) ||
           is(FieldPart::co, FieldPart::cross);
}

// The two parts of one basis, added sample by sample at each frequency.
Result<FarFieldSet> by_polarisation(FarFieldSet a, const FarFieldSet& b, const std::string& na, const std::string& nb) {
    if (!pair_of_one_basis(a.part, b.part))
        return fail(na + " and " + nb + ": expected the two parts of one basis (E_theta and E_phi, RHCP and LHCP, " +
                    "co- and cross-polar), found " + to_string(a.part) + " and " + to_string(b.part));
    for (std::size_t k = 0; k < std::max(a.frequencies.size(), b.frequencies.size()); ++k) {
        const bool in_a = k < a.frequencies.size(), in_b = k < b.frequencies.size();
        const double fa = in_a ? a.frequencies[k].frequency_hz : 0, fb = in_b ? b.frequencies[k].frequency_hz : 0;
        if (!in_a || !in_b || std::abs(fa - fb) > 1e-9 * std::max(1.0, fa)) {
            const bool a_lacks = !in_a || (in_b && fb < fa);
            return fail((a_lacks ? na : nb) + ": expected " + frequency_words(a_lacks ? fb : fa) + " as in " +
                        (a_lacks ? nb : na) + " (each part at every frequency), found none");
        }
        FarField& f = a.frequencies[k];
        const FarField& g = b.frequencies[k];
        for (std::size_t i = 0; i < f.e_theta.size(); ++i) {
            f.e_theta[i] += g.e_theta[i];
            f.e_phi[i] += g.e_phi[i];
        }
    }
    a.part = FieldPart::whole;
    return a;
}

}  // namespace

Result<FarFieldSet> merge_sets(std::vector<NamedSet> sets) {
    if (sets.empty()) return fail("expected a pattern to merge, found none");
    if (sets.size() == 1) return std::move(sets[0].set);
    for (std::size_t i = 1; i < sets.size(); ++i) {
        if (Status st = same_grids(sets[0], sets[i]); !st) return st.error();
        if (Status st = same_kind(sets[0], sets[i]); !st) return st.error();
    }
    std::vector<std::vector<NamedSet*>> groups;  // by part, in the order the parts first appear
    for (NamedSet& n : sets) {
        auto g = std::find_if(groups.begin(), groups.end(), [&](const auto& x) { return x[0]->set.part == n.set.part; });
        if (g == groups.end()) groups.push_back({&n});
        else g->push_back(&n);
    }
    if (groups.size() > 2)
        return fail(groups[0][0]->name + ", " + groups[1][0]->name + " and " + groups[2][0]->name +
                    ": expected the two parts of one basis, found three parts (" + to_string(groups[0][0]->set.part) +
                    ", " + to_string(groups[1][0]->set.part) + ", " + to_string(groups[2][0]->set.part) + ")");
    auto first = by_frequency(groups[0]);
    if (!first) return first;
    std::string what = "frequencies";
    if (groups.size() == 2) {
        auto second = by_frequency(groups[1]);
        if (!second) return second;
        first = by_polarisation(std::move(*first), *second, groups[0][0]->name, groups[1][0]->name);
        if (!first) return first;
        what = std::string(to_string(groups[0][0]->set.part)) + " and " + to_string(groups[1][0]->set.part) + " parts";
    }
    std::string names;
    first->reading_notes.clear();
    for (const NamedSet& n : sets) {
        names += (names.empty() ? "" : " + ") + n.name;
        for (const std::string& note : n.set.reading_notes) first->reading_notes.push_back(n.name + ": " + note);
    }
    first->source = names;
    first->reading_notes.push_back("merged " + what + " from " + std::to_string(sets.size()) + " files: " + names);
    return first;
}

}  // namespace ellipsa
