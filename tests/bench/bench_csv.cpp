// CSV importer benchmark: prints figures, never fails on a slow machine.
//   writes a ~1-million-row, 16-frequency complex-family file (~75 MB) to a scratch folder,
//   reads it with all cores and with one (issue 18: >= 800 MB/s per core of CPU time), and measures the peak resident
//   memory of a child process that only reads it against the size of the final arrays
//   (target below 2x). Usage: bench_csv [SCRATCH_DIR]  (default: /tmp); it leaves the file
//   there as bench_csv_1m.csv for the `ellipsa info` against pandas comparison in run.sh.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <string>
#include <sys/resource.h>
#include <sys/wait.h>
#include <thread>
#include <unistd.h>

#include "importers/csv_passes.hpp"
#include "importers/far_field_csv.hpp"
#include "pattern/integrate.hpp"

using namespace ellipsa;

namespace {

// 16 frequencies of an invented two-element array: a phase-steered pair of short dipoles with a
// little cross-polar part, so every column has full-length, varied numbers.
std::string make_file() {
    std::string out;
    out.reserve(80u << 20);
    out += "# quantity: gain\n# name: bench array\n# frequency-unit: Hz\n";
    out += "frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    char buf[200];
    for (int f = 0; f < 16; ++f) {
        const double fhz = 2.4e9 + 5e6 * f;
        const double kd = 2 * pi * 0.5 * fhz / 2.4e9;
        for (int t = 0; t <= 180; ++t)
            for (int p = 0; p < 360; ++p) {
                const double tr = t * deg, pr = p * deg;
                const double psi = kd * std::sin(tr) * std::cos(pr) - 0.3 * f;
                const cplx af = 1.0 + std::polar(1.0, psi);
                const cplx et = 1.2247 * std::sin(tr) * af * 0.5;
                const cplx ep = 0.05 * std::cos(tr) * std::sin(pr) * af;
                int n = std::snprintf(buf, sizeof buf, "%.0f,%d,%d,%.8g,%.8g,%.8g,%.8g\n", fhz, t, p, et.real(),
                                      et.imag(), ep.real(), ep.imag());
                out.append(buf, std::size_t(n));
            }
    }
    return out;
}

double seconds_since(std::chrono::steady_clock::time_point t0) {
    return std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
}

double process_cpu_seconds() {
    struct rusage ru {};
    getrusage(RUSAGE_SELF, &ru);
    return double(ru.ru_utime.tv_sec + ru.ru_stime.tv_sec) + 1e-6 * double(ru.ru_utime.tv_usec + ru.ru_stime.tv_usec);
}

// One frequency of a 0.5-degree grid (260 000 points) written twice: in the usual layout, and as
// a range's polar sweeps (theta -180..180 over phi 0..179.5: the angle layouts of
// importers/csv_directions.hpp, read as a table, then placed direction by direction).
void bench_angle_layouts() {
    std::string usual = "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n", sweeps = usual;
    char buf[200];
    for (int ti = 0; ti <= 360; ++ti)
        for (int pi2 = 0; pi2 < 720; ++pi2) {
            const double t = 0.5 * ti, p = 0.5 * pi2, tr = t * deg, pr = p * deg;
            // An x dipole and a z loop in quadrature: one field vector at each pole, whatever phi.
            const cplx et = std::cos(tr) * std::cos(pr), ep = cplx(-std::sin(pr), 0.5 * std::sin(tr));
            int n = std::snprintf(buf, sizeof buf, "%g,%g,%.8g,%.8g,%.8g,%.8g\n", t, p, et.real(), et.imag(), ep.real(), ep.imag());
            usual.append(buf, std::size_t(n));
            const bool back = p >= 180;  // (t, p) = (-t, p - 180) with both components negated
            n = std::snprintf(buf, sizeof buf, "%g,%g,%.8g,%.8g,%.8g,%.8g\n", back ? -t : t, back ? p - 180 : p,
                              back ? -et.real() : et.real(), back ? -et.imag() : et.imag(), back ? -ep.real() : ep.real(),
                              back ? -ep.imag() : ep.imag());
            sweeps.append(buf, std::size_t(n));
        }
    auto best_cpu = [](const std::string& text) {
        double best = 1e300;
        for (int r = 0; r < 4; ++r) {
            CsvReadOptions o;
            o.threads = 1;
            const double c0 = process_cpu_seconds();
            auto s = parse_far_field_csv(text, "layout.csv", o);
            if (!s) std::printf("read failed: %s\n", s.error().format().c_str());
            best = std::min(best, process_cpu_seconds() - c0);
        }
        return best;
    };
    const double a = best_cpu(usual), b = best_cpu(sweeps);
    std::printf("angle layouts, 260 000 points, 1 thread CPU: usual %.1f ms, theta -180..180 sweeps %.1f ms (%.2fx)\n",
                1e3 * a, 1e3 * b, b / a);
}

}  // namespace

int main(int argc, char** argv) {
    const std::string dir = argc > 1 ? argv[1] : "/tmp";
    const std::string path = dir + "/bench_csv_1m.csv";
    {
        std::FILE* f = std::fopen(path.c_str(), "rb");
        if (f) std::fclose(f);
        if (!f) {
            const std::string text = make_file();
            f = std::fopen(path.c_str(), "wb");
            if (!f || std::fwrite(text.data(), 1, text.size(), f) != text.size()) {
                std::printf("cannot write %s\n", path.c_str());
                return 0;
            }
            std::fclose(f);
        }
    }
    std::FILE* f = std::fopen(path.c_str(), "rb");
    std::fseek(f, 0, SEEK_END);
    const double mb = double(std::ftell(f)) / 1e6;
    std::fclose(f);

    auto cpu_seconds = [] {
        struct rusage ru {};
        getrusage(RUSAGE_SELF, &ru);
        return double(ru.ru_utime.tv_sec + ru.ru_stime.tv_sec) + 1e-6 * double(ru.ru_utime.tv_usec + ru.ru_stime.tv_usec);
    };
    double best_cpu = 1e300;
    auto run = [&](int threads, std::size_t* rows, std::size_t* array_bytes) {
        double best = 1e300;
        for (int r = 0; r < 4; ++r) {
            CsvReadOptions o;
            o.threads = threads;
            const double c0 = cpu_seconds();
            auto t0 = std::chrono::steady_clock::now();
            auto s = read_far_field_csv(path, o);
            const double sec = seconds_since(t0);
            if (threads == 1) best_cpu = std::min(best_cpu, cpu_seconds() - c0);
            if (!s) {
                std::printf("read failed: %s\n", s.error().format().c_str());
                return 0.0;
            }
            best = std::min(best, sec);
            if (rows) *rows = s->grid.size() * s->frequencies.size();
            if (array_bytes) *array_bytes = s->grid.size() * s->frequencies.size() * 2 * sizeof(cplx);
        }
        return best;
    };
    std::size_t rows = 0, bytes = 0;
    const unsigned cores = std::max(1u, std::thread::hardware_concurrency());
    const double t_all = run(0, &rows, &bytes);
    const double t_one = run(1, nullptr, nullptr);
    std::printf("file: %s, %.1f MB, %zu rows, 16 frequencies (%zu of 8 reads in one pass on a guessed grid)\n",
                path.c_str(), mb, rows, csv::one_pass_reads.load());
    std::printf("read, %u threads: %8.1f ms  %7.0f MB/s  (wall clock, all cores; the goal is per core, below)\n", cores, 1e3 * t_all, mb / t_all);
    std::printf("read, 1 thread:   %8.1f ms  %7.0f MB/s  (CPU time %.1f ms: %.0f MB/s per core, whatever the load;\n"
                "  target >= 800 MB/s per core)\n",
                1e3 * t_one, mb / t_one, 1e3 * best_cpu, mb / best_cpu);
    double load = 0;
    if (std::FILE* la = std::fopen("/proc/loadavg", "r")) {
        if (std::fscanf(la, "%lf", &load) != 1) load = 0;
        std::fclose(la);
    }
    std::printf("(load average %.1f on %u cores while measuring: wall-clock figures drop when other work runs)\n", load, cores);

    // Peak resident memory of a process that only reads the file.
    const pid_t pid = fork();
    if (pid == 0) {
        auto s = read_far_field_csv(path);
        _exit(s ? 0 : 1);
    }
    int status = 0;
    struct rusage ru {};
    wait4(pid, &status, 0, &ru);
    struct rusage self {};
    getrusage(RUSAGE_SELF, &self);
    const double peak_mb = double(ru.ru_maxrss) / 1024.0;
    const double arrays_mb = double(bytes) / 1048576.0;
    std::printf("peak resident memory of a read: %.1f MiB for %.1f MiB of final arrays (%.2fx; target < 2x;\n"
                "  includes the program itself and the mapped pages not yet dropped)\n",
                peak_mb, arrays_mb, peak_mb / arrays_mb);
    bench_angle_layouts();
    return 0;
}
