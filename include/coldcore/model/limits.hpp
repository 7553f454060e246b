#pragma once
/// Plausibility ranges of every quantity coldcore reads, stated once (issue 18). A value outside
/// its range is refused where it is read, with the file, the key as written, the value and the
/// range in the key's own unit. The ranges are wide enough for every food process (freezing in
/// liquid nitrogen to frying oil, a 1 mm flake to a 3 m carcass side) and narrow enough that no
/// arithmetic downstream overflows or underflows: with them the Biot number h·R/k stays within
/// [5e-6, 1.5e8] (the eigenvalue solver takes 1e-6 to ∞), and exponents of lethal rates stay
/// far from the double range. They are not claims about any food: they catch unit mistakes and
/// garbage; the product's own data decide the rest.
#include <cstddef>

namespace coldcore::limits {

struct Range {
  double low = 0, high = 0;  ///< inclusive, in SI (m, s, °C, W/(m K), kg/m³, J/(kg K), W/(m² K))
  bool contains(double v) const { return v >= low && v <= high; }  // false for NaN
};

/// Product sizes (diameter, length, full thickness, brick edges): 1 mm to 3 m.
inline constexpr Range length_m{1e-3, 3.0};
/// Thermal conductivity: from porous, air-filled foods (~0.05) to ice (~2.2) with room to spare.
inline constexpr Range conductivity_W_mK{0.01, 10.0};
/// Density: puffed and porous foods (~100) to the densest foods and brines (~1,400), widened.
inline constexpr Range density_kg_m3{50.0, 3000.0};
/// Specific heat: dry foods (~1,200) to water (~4,200), widened; apparent values in freezing
/// are computed, never read.
inline constexpr Range specific_heat_J_kgK{500.0, 10000.0};
/// Absolute zero, °C (the kelvin's definition, SI Brochure 9th ed.): no temperature read may be below it.
inline constexpr double absolute_zero_C = -273.15;
/// Every temperature read (product, media, targets, logs): liquid nitrogen (−196 °C) to frying
/// oil and ovens (≤ 300 °C), widened.
inline constexpr Range temperature_C{-200.0, 400.0};
/// Finite surface heat-transfer coefficients: still air (~2) to condensing steam (~1e4–1e5),
/// widened; `inf` (a surface held at the medium temperature) is accepted where stated.
inline constexpr Range h_W_m2K{0.1, 1e6};
/// Every time read (stage durations, caps, points, holds, required F, D values): up to a year.
inline constexpr Range duration_s{0.0, 366.0 * 86400.0};
/// z-values: microbial spores and cells (~5–15 °C) to quality factors (~20–50 °C), widened.
inline constexpr Range z_C{1.0, 100.0};

/// Counts. A process has a handful of stages and targets; the bounds keep run time and output
/// proportionate (thousands of stages cost minutes) and are said when they are hit.
inline constexpr std::size_t max_stages = 200;
inline constexpr std::size_t max_targets = 100;
/// Rows of a history table (run --format csv and the like): 1,000,000 (a year at 32 s, 4 h at 0.1 s).
inline constexpr std::size_t max_output_rows = 1000000;
/// Data rows of one log: 5,000,000 (58 days at 1 s, a year at 7 s); a 1-s log of a week has 604,800.
inline constexpr std::size_t max_log_rows = 5000000;
/// Characters of an error message; a longer one (a megabyte-long key quoted back) is cut.
inline constexpr std::size_t max_message_chars = 2000;

}  // namespace coldcore::limits
