// Reader for the neutral far-field CSV schema, version 1 (docs/far-field-csv.md), as named
// stages: layout (csv_layout.hpp: metadata, delimiter, header, column map, family, settings),
// pass 1 (csv_passes.hpp: angle and frequency cells), plan and size the grid, allocate, pass 2
// (every cell into place), seam, poles, completeness (csv_grid.hpp).
#include <algorithm>
#include <cstring>
#include <optional>
#include <thread>

#include "importers/csv_directions.hpp"
#include "importers/csv_grid.hpp"
#include "importers/csv_layout.hpp"
#include "importers/csv_passes.hpp"
#include "importers/far_field_csv.hpp"
#include "importers/text.hpp"
#include "importers/text_source.hpp"
#include "pattern/merge.hpp"

namespace ellipsa {

using namespace csv;

const std::vector<std::string>& csv_schema_columns() {
    static const std::vector<std::string> v = [] {
        std::vector<std::string> o;
        for (int k = 0; k < c_count; ++k) o.emplace_back(column_name(k));
        return o;
    }();
    return v;
}

namespace {

// Workers: as asked, else one per core (at most 8), and one for inputs under 4 MB.
int worker_count(const CsvReadOptions& o, std::size_t data_bytes) {
    if (o.threads > 0) return std::min(o.threads, 8);
    if (data_bytes < (std::size_t(4) << 20)) return 1;
    return int(std::min(8u, std::max(1u, std::thread::hardware_concurrency())));
}

// What a pass left behind: cancelled, a read failure, a finding in the text.
Status after_pass(const Context& ctx, const std::vector<Chunk>& chunks, const std::string& file) {
    if (ctx.cancelled) return Error{file, 0, 0, "reading cancelled"};
    if (const Failure* f = first_failure(chunks)) return to_error(*ctx.source, file, *f);
    return Ok{};
}

FarFieldSet empty_set(const Layout& L, const std::string& file) {
    FarFieldSet s;
    s.name = L.name.empty() ? file : L.name;
    s.source = L.source.empty() ? file : L.source;
    s.note = L.note;
    s.file_mounting = L.mounting;
    if (L.skipped_lines > 0)
        s.reading_notes.push_back("skipped " + std::to_string(L.skipped_lines) + " line" + (L.skipped_lines == 1 ? "" : "s") +
                                  " of free text before the header row (line " + std::to_string(L.header_line) + ")");
    s.quantity = L.quantity;
    s.ludwig3_reference = L.ludwig3_reference ? *L.ludwig3_reference : Ludwig3Reference::x;
    s.ludwig3_declared = L.ludwig3_reference.has_value();
    s.time_convention_converted = L.minus_iwt;
    s.content = L.family == CsvFamily::magnitude_db ? FieldContent::magnitude_only
                : L.family == CsvFamily::total_db   ? FieldContent::total_only
                                                    : FieldContent::complex;
    s.part = L.part;
    return s;
}

// A layout whose angles as written are not the stored grid: the table must be complete, then
// its directions are placed (csv_directions.hpp).
Result<FarFieldSet> read_directions(FarFieldSet table, const SeenPoints& seen, const std::vector<std::vector<std::size_t>>& lines,
                                    const Layout& L, const TextSource& src, const std::string& file, const CsvReadOptions& o) {
    if (Status st = check_complete(table, seen, L, false, file); !st) return st.error();
    auto s = place_directions(std::move(table), lines, L, src, file);
    if (s) s->grid.sampling = L.sampling ? *L.sampling : inferred_sampling(s->grid);  // of the placed grid
    if (s && o.progress) o.progress(1.0);
    return s;
}

// The stages after the last pass of a usual (not raw) grid: seam, poles, completeness.
Result<FarFieldSet> finish(FarFieldSet s, SeenPoints& seen, const std::vector<Chunk>& chunks, const Layout& L,
                           const TextSource& src, const std::string& file, const CsvReadOptions& o) {
    if (Status st = merge_seam(chunks, s, seen, L, src, file); !st) return st.error();
    const bool lone_pole_without_phase = fill_poles(s, seen);
    if (Status st = check_complete(s, seen, L, lone_pole_without_phase, file); !st) return st.error();
    if (o.progress) o.progress(1.0);
    return s;
}

// A large file in one pass: pass 1 over samples guesses the grid, one_pass reads every row onto
// it and collects what pass 1 would have, and plan_grid on that must give the guessed plan (so
// every value is where two passes put it). None when the guess cannot be made or is not
// confirmed, or when the pass met anything in the text (two passes then read the file again and
// report what they find, in their order); a read error or cancelling ends the read.
std::optional<Result<FarFieldSet>> one_pass_read(Context& ctx, const Layout& L, const TextSource& src, const std::string& file,
                                                 const CsvReadOptions& o) {
    const std::size_t data = src.size() - std::min(src.size(), L.data_offset);
    if (data < one_pass_min_bytes.load()) return std::nullopt;
    std::optional<GridPlan> guess;
    std::size_t sample_rows = 0, sample_bytes = 0;
    {  // the samples' heap is given back before the arrays are allocated
        const auto ranges = sample_ranges(src, L.data_offset);
        std::vector<Chunk> samples(1);
        pass1_ranges(ctx, samples[0], ranges);
        if (samples[0].failure.set) return std::nullopt;
        sample_rows = samples[0].rows;
        for (const auto& [b, e] : ranges) sample_bytes += e - b;
        if (sample_rows) guess = guess_plan(samples, L, src);
    }
    if (!guess) return std::nullopt;
    guess->grid.sampling = L.sampling ? *L.sampling : inferred_sampling(guess->grid);
    FarFieldSet s = empty_set(L, file);
    const auto rows_about = std::size_t(double(data) * double(sample_rows) / double(std::max<std::size_t>(1, sample_bytes)));
    if (!check_grid_size(*guess, rows_about, s.content, o, file)) return std::nullopt;
    SeenPoints seen;
    const int workers = worker_count(o, data);
    allocate(*guess, s, seen, workers);
    std::vector<Chunk> chunks = split(src, L.data_offset, workers);
    ctx.plan = &*guess;
    ctx.out = &s.frequencies;
    ctx.seen = &seen;
    ctx.lines = nullptr;
    ctx.concurrent = chunks.size() > 1;
    run_chunks(chunks, [&](Chunk& c, bool first) { one_pass(ctx, c, first); });
    const Failure* f = first_failure(chunks);
    if (ctx.cancelled || (f && f->io)) return Result<FarFieldSet>(after_pass(ctx, chunks, file).error());
    std::size_t rows = 0;
    for (const Chunk& c : chunks) rows += c.rows;
    if (f || rows == 0) return std::nullopt;
    auto plan = plan_grid(chunks, L, src, file);
    if (!plan) return std::nullopt;
    plan->grid.sampling = L.sampling ? *L.sampling : inferred_sampling(plan->grid);
    if (!same_plan(*plan, *guess) || !check_grid_size(*plan, rows, s.content, o, file)) return std::nullopt;
    ++one_pass_reads;
    return finish(std::move(s), seen, chunks, L, src, file, o);
}

// The progress the caller sees when the file is read again (a one pass whose guess was not
// confirmed, a refusal settled with one worker): the next read reports over the rest of the way
// from where the one before left it, instead of going back to 0.
struct ProgressSpan {
    const std::function<bool(double)>& to;
    double from = 0, reached = 0;
    bool operator()(double f) {
        reached = std::max(reached, from + (1 - from) * f);
        return to(reached);
    }
    void again() { from = reached; }
};

// The stages in order; any refusal ends the read with nothing partial returned. o.progress is
// `span` when there is one.
Result<FarFieldSet> read_stages_once(const TextSource& src, const std::string& file, const CsvReadOptions& o,
                                     ProgressSpan* span) {
    auto layout = read_layout(src, file, o);
    if (!layout) return layout.error();
    const Layout& L = *layout;
    Context ctx;
    ctx.source = &src;
    ctx.L = &L;
    ctx.options = &o;
    if (auto one = one_pass_read(ctx, L, src, file, o)) return std::move(*one);
    if (span) span->again();
    ctx.stop = false;
    std::vector<Chunk> chunks = split(src, L.data_offset, worker_count(o, src.size() - L.data_offset));

    run_chunks(chunks, [&](Chunk& c, bool first) { pass1(ctx, c, first); });
    if (Status st = after_pass(ctx, chunks, file); !st) return st.error();
    std::size_t rows = 0;
    for (const Chunk& c : chunks) rows += c.rows;
    if (rows == 0) return Error{file, L.header_line, 0, "expected data rows after the header row, found none"};

    FarFieldSet s = empty_set(L, file);
    auto plan = plan_grid(chunks, L, src, file);
    if (!plan) return plan.error();
    plan->grid.sampling = L.sampling ? *L.sampling : inferred_sampling(plan->grid);
    if (Status st = check_grid_size(*plan, rows, s.content, o, file); !st) return st.error();
    SeenPoints seen;
    allocate(*plan, s, seen, int(chunks.size()));
    std::vector<std::vector<std::size_t>> lines;
    if (plan->raw) lines.assign(s.frequencies.size(), std::vector<std::size_t>(s.grid.size(), 0));

    ctx.plan = &*plan;
    ctx.out = &s.frequencies;
    ctx.seen = &seen;
    ctx.lines = plan->raw ? &lines : nullptr;
    ctx.concurrent = chunks.size() > 1;
    run_chunks(chunks, [&](Chunk& c, bool first) { pass2(ctx, c, first); });
    if (Status st = after_pass(ctx, chunks, file); !st) return st.error();
    if (plan->raw) return read_directions(std::move(s), seen, lines, L, src, file, o);
    return finish(std::move(s), seen, chunks, L, src, file, o);
}

// Several workers read a file's parts at once, so which of two findings in different parts
// they meet first can depend on timing (a point given twice is found by whichever row is
// written second in time, not in the file). A refusal tied to a line of a read made by several
// workers is therefore settled by reading again with one: the message is always the first
// finding in the file's order, the same on every run. Refusals cost the second read; a read
// that succeeds, is cancelled or fails on the system's side (no line) is not repeated.
Result<FarFieldSet> read_stages(const TextSource& src, const std::string& file, const CsvReadOptions& o) {
    std::optional<ProgressSpan> span;
    CsvReadOptions mine = o;
    if (o.progress) {
        span.emplace(ProgressSpan{o.progress});
        mine.progress = [&](double f) { return (*span)(f); };
    }
    ProgressSpan* const s = span ? &*span : nullptr;
    auto r = read_stages_once(src, file, mine, s);
    if (r || r.error().line == 0 || worker_count(o, src.size()) < 2) return r;
    if (s) s->again();
    mine.threads = 1;
    return read_stages_once(src, file, mine, s);
}

}  // namespace

Result<FarFieldSet> parse_far_field_csv(std::string_view text, const std::string& name, const CsvReadOptions& o) {
    return read_stages(TextSource::memory(text), name, o);
}

Result<FarFieldSet> read_far_field_csv(const std::string& path, const CsvReadOptions& o) {
    auto src = TextSource::open(path);
    if (!src) return src.error();
    // A first guess from the size before reading: the arrays take about half the file's size
    // for the usual layouts (32 bytes per point, 60-90 bytes per row); a file more than four
    // times the available memory cannot fit whatever its layout. The exact check follows pass 1.
    const std::size_t limit = o.memory_limit_bytes ? o.memory_limit_bytes : available_memory_bytes();
    if (limit > 0 && src->size() / 4 > limit)
        return Error{path, 0, 0, "expected a file that fits in memory: it holds " + text::number(double(src->size()) / 1e6) +
                                     " MB, " + text::number(double(limit) / 1e6) + " MB are available"};
    auto r = read_stages(*src, path, o);
    // A file that changed under the reader: say so, whatever the stages made of it.
    if (Status st = src->unchanged(); !st) return st.error();
    return r;
}

Result<FarFieldSet> read_joined_far_field_csv(const std::string& path, const std::vector<std::string>& join,
                                              const CsvReadOptions& o) {
    auto first = read_far_field_csv(path, o);
    if (!first || join.empty()) return first;
    std::vector<NamedSet> sets;
    sets.push_back({path, std::move(*first)});
    for (const std::string& other : join) {
        auto s = read_far_field_csv(other, o);
        if (!s) return s;
        sets.push_back({other, std::move(*s)});
    }
    return merge_sets(std::move(sets));
}

}  // namespace ellipsa
