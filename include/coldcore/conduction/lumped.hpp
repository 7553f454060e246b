#pragma once
/// Dimensionless groups and the lumped-capacitance (uniform-temperature) solution, with a
/// comparison against the exact series.
///
/// Two length conventions are in use and both appear here:
///   * the series Bi and Fo use the half-size L_s: half-thickness (slab), radius R (cylinder, sphere);
///   * the lumped criterion uses Lc = V/A: L (slab), R/2 (long cylinder), R/3 (sphere).
/// Lumped capacitance is acceptable for Bi_c = h·Lc/k < 0.1 (REFERENCES.md §3.2: Incropera §5.1,
/// Çengel §4-1 — common practice). With m = 0, 1, 2 (slab, cylinder, sphere):
///     Bi_c = Bi/(m+1),  θ_lumped = exp(−Bi_c·Fo_c) = exp(−(m+1)·Bi·Fo).
#include <string>

#include "coldcore/conduction/series.hpp"
#include "coldcore/model/shape.hpp"

namespace coldcore {

/// Bi = h·L/k. REQUIRES: h_W_m2K >= 0, length_m > 0, k_W_mK > 0 (InputError otherwise).
double biot_number(double h_W_m2K, double length_m, double k_W_mK);

/// Fo = α·t/L². REQUIRES: alpha_m2_s > 0, time_s >= 0, length_m > 0.
double fourier_number(double alpha_m2_s, double time_s, double length_m);

/// α = k/(ρ·cp). REQUIRES: all > 0.
double thermal_diffusivity_m2_s(double k_W_mK, double density_kg_m3, double specific_heat_J_kgK);

/// Lc = V/A for the half-size L_s (half-thickness or radius): L_s, L_s/2, L_s/3.
/// REQUIRES: half_size_m > 0.
double lumped_length_m(Geometry g, double half_size_m);

/// Bi_c = h·Lc/k from the series Biot number (based on L_s): Bi/(m+1). REQUIRES: biot >= 0.
double lumped_biot(Geometry g, double biot);

/// Threshold of the lumped criterion, Bi_c < 0.1 (common practice, REFERENCES.md §3.2).
inline constexpr double kLumpedBiotLimit = 0.1;

/// θ = exp(−Bi_c·Fo_c) with both groups based on Lc. REQUIRES: both >= 0.
double lumped_theta(double biot_lumped, double fourier_lumped);

/// θ = exp(−(m+1)·Bi·Fo) with the series' groups (based on L_s). REQUIRES: biot >= 0, fourier >= 0.
double lumped_theta(Geometry g, double biot, double fourier);

/// Empty if Bi_c <= 0.1; otherwise a warning, e.g.
/// "lumped capacitance with Bi = 0.333 (Lc = V/A = R/3 for a sphere) > 0.1: the product is not
///  at a uniform temperature; the centre lags the lumped value, use the exact series".
std::string lumped_warning(Geometry g, double biot);

struct LumpedComparison {
  double biot_lumped = 0;     ///< Bi_c = h·Lc/k
  double lumped = 0;          ///< θ_lumped
  StepResponse exact_centre;  ///< series θ at x = 0
  StepResponse exact_mean;    ///< series mass-average θ
  double centre_difference = 0;  ///< lumped − exact centre
  double mean_difference = 0;    ///< lumped − exact mean
  bool lumped_valid = false;     ///< Bi_c <= 0.1
  std::string warning;           ///< lumped_warning(g, biot)
};

/// Lumped versus exact at the centre and for the mean at one Fourier number (series groups).
/// REQUIRES: as step_response.
LumpedComparison compare_lumped(Geometry g, double biot, double fourier, const SeriesOptions& opts = {});

}  // namespace coldcore
