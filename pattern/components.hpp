// Component facts: the one home for what every front end (command line, viewer, cut figures,
// report) needs to know about a shown component: its name, its labels, its dB unit, whether a
// set can give it (and why not), and its linear power at one sample, along a list of samples or
// over the whole grid.
//
// Components (conventions.md, IEEE Std 145-2013, Ludwig 1973), powers in the set's quantity:
//   total |Et|^2 + |Ep|^2; theta / vertical |Et|^2; phi / horizontal |Ep|^2;
//   rhcp |Et + j Ep|^2 / 2; lhcp |Et - j Ep|^2 / 2;
//   co / cross: Ludwig-3 with the set's reference (x: co = Et cos p - Ep sin p, cross = Et sin p + Ep cos p;
//   y: co and cross swapped).
// Vertical and horizontal are the theta and phi parts of an antenna whose up axis is +z.
#pragma once
#include <cstddef>
#include <optional>
#include <string>

#include "pattern/far_field.hpp"

namespace ellipsa {

enum class Component { total, theta, phi, vertical, horizontal, co, cross, rhcp, lhcp };
inline constexpr Component all_components[] = {Component::total, Component::theta,  Component::phi,
                                               Component::vertical, Component::horizontal,
                                               Component::co, Component::cross, Component::rhcp,
                                               Component::lhcp};

// Machine name: "total", "theta", "phi", "vertical", "horizontal", "co", "cross", "rhcp", "lhcp"
// (command-line values, JSON, CSV column names, settings files).
const char* to_string(Component c);
// Parse a machine name; false when unknown.
bool parse_component(const char* name, Component& out);

// Short label, for places with little room (check boxes, legends on screen):
// "Total", "Eθ", "Eφ", "Vertical", "Horizontal", "Co-polar", "Cross-polar", "RHCP", "LHCP".
const char* short_label(Component c);
// Long label, for menus, figure legends and reports: "θ component", "Co-polar (Ludwig-3, x ref.)", ...
std::string long_label(Component c, Ludwig3Reference ref);

// True for the circular parts (their gain is in dBic).
bool is_circular(Component c);
// True when the component needs phase: circular parts and Ludwig-3 co/cross mix E_theta and
// E_phi coherently.
bool needs_phase(Component c);
// The dB unit of a component's power: "dBic" for the circular parts of gain or directivity,
// "dBi" for the others, "dB" for relative data.
const char* db_unit(Quantity q, Component c);
// The quantity's name for axis titles and tables: "Gain", "Directivity", "Relative power".
const char* quantity_label(Quantity q);

// Why a set cannot give a component honestly, or nullopt when it can: a set without frequencies;
// total-only data have no theta/phi split; circular and Ludwig-3 parts need the phase between
// E_theta and E_phi.
std::optional<std::string> component_unavailable(const FarFieldSet& s, Component c);
// Why a set cannot give polarisation figures (axial ratio, tilt, sense, Stokes U and V), or
// nullopt when it can: they need the phase between E_theta and E_phi.
std::optional<std::string> polarisation_unavailable(const FarFieldSet& s);

// Linear power of one component at one sample. cos_phi and sin_phi (of the sample's phi) are
// used by co and cross only.
inline double component_power(cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref,
                              Component c) {
    const double a = std::norm(et), b = std::norm(ep);
    switch (c) {
        case Component::total: return a + b;
        case Component::theta:
        case Component::vertical: return a;
        case Component::phi:
        case Component::horizontal: return b;
        case Component::rhcp: return 0.5 * std::norm(et + cplx(-ep.imag(), ep.real()));
        case Component::lhcp: return 0.5 * std::norm(et - cplx(-ep.imag(), ep.real()));
        case Component::co:
        case Component::cross: {
            // Ludwig-3 x: |co|^2 = a c^2 + b s^2 - 2 cs Re(Et Ep*), |cross|^2 = a s^2 + b c^2 + 2 cs Re(Et Ep*).
            const double cr = et.real() * ep.real() + et.imag() * ep.imag();
            const double c2 = cos_phi * cos_phi, s2 = sin_phi * sin_phi, cs2 = 2 * cos_phi * sin_phi * cr;
            const bool x_co = (c == Component::co) == (ref == Ludwig3Reference::x);
            return x_co ? a * c2 + b * s2 - cs2 : a * s2 + b * c2 + cs2;
        }
    }
    return a + b;
}

// Batch form over n samples (structure of arrays): out[k] = component_power(e_theta[k], e_phi[k],
// cos_phi[k], sin_phi[k], ref, c). cos_phi and sin_phi may be null unless c is co or cross.
// Cost: one pass, a few multiplications per sample, no allocation; out is caller-owned (n values).
void component_power_many(std::size_t n, const cplx* e_theta, const cplx* e_phi, const double* cos_phi,
                          const double* sin_phi, Ludwig3Reference ref, Component c, double* out);

// Linear power of one component at every grid sample of one frequency, in the grid's layout
// (theta rows slow, phi columns fast). `out` is caller-owned and holds s.grid.size() values; only
// the theta rows [first_row, end_row) are written (end_row < 0: to the last row), so callers can
// split the grid between threads. Cost: one pass through component_power_many, no allocation but
// a cos/sin table of the phi columns for co and cross. The caller checks component_unavailable()
// first (an unavailable component gives the power of the stored values).
void component_power_grid(const FarFieldSet& s, std::size_t freq_index, Component c, double* out, int first_row = 0,
                          int end_row = -1);

}  // namespace ellipsa
