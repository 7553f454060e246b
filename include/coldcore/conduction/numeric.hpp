#pragma once
/// One-dimensional finite-volume conduction solver for a slab (half-thickness L), an infinite
/// cylinder or a sphere (radius R), symmetric about the centre, with a convective (or, for
/// h = ∞, prescribed-temperature) surface to a medium whose temperature is piecewise linear in
/// time, and temperature-dependent properties k(T) and ρcp(T).
///
/// Use it where the exact series cannot serve (properties that follow temperature, composition
/// models) and as an independent check of the series.
///
/// Method (the reasons are in src/conduction/numeric*.cpp):
/// - Vertex-centred finite volumes on a uniform grid r_i = i·R/N, i = 0..N: node 0 is the centre,
///   node N the surface, so both are reported without extrapolation; control volumes are the
///   exact shell volumes between face midpoints (energy per unit surface area is exact).
/// - Enthalpy (conservative) form: node energy uses the chord capacity
///   (H(T^{n+1}) − H(T^n))/(T^{n+1} − T^n) with H = ∫ρcp dT by 3-point Gauss–Legendre
///   quadrature (exact for ρcp polynomials up to degree 5), so the heat that crosses the surface
///   equals the change of enthalpy to the Picard tolerance. Face conductivity k((T_i+T_{i+1})/2).
/// - Crank–Nicolson in time; the first two steps of every segment are each taken as two
///   backward-Euler half-steps (Rannacher start-up) to damp the jump at the surface when the
///   medium or h changes. Picard iteration per step on k and ρcp; a Thomas tridiagonal solve.
/// - Phase change (an enthalpy callable is given): the step equations are solved by the enthalpy
///   iteration of Swaminathan & Voller (1992), "A general enthalpy method for modeling
///   solidification processes", Metall. Trans. B 23:651–664, safeguarded to take the smaller of
///   the linear and the mapped-back move (Picard on the chord capacity cycles at band edges).
/// - Time steps land on every output time, medium breakpoint and segment boundary; the base step
///   grows geometrically from a small first step after each segment start.
/// - Self-check (Richardson): the problem is solved on level ℓ and ℓ+1 (cells doubled AND every
///   step halved, so nodes and instants nest). For a second-order method the error of the finer
///   solution is ≈ |fine − coarse|/3; the finer solution is returned when that estimate, over the
///   centre, surface and mean at every output time, is ≤ tol_K. Otherwise the next level is
///   added. Past max_level: NotConverged (never an unconverged answer). With an enthalpy callable
///   (phase change) the estimate is |fine − coarse| (first order), which is conservative.
///   The check covers only what is reported (centre, surface, mean at the requested times), not
///   interior points of node_T_C.
///
/// Measured (tests/conduction/numeric_test.cpp, default options): against the exact series
/// (90 rows: sphere, cylinder, slab; Bi 0.5, 5, 20, 50, ∞; Fo 0.02 to 2) worst 0.0017 K; against
/// an independent SciPy solution with k(T), ρcp(T), a ramped medium and an h change worst
/// 0.0009 K; the self-check estimate was within 2 % of the actual error in every case; observed
/// order 2.00. Cost: about 30–150 ms for a 40 mm product over Fo ≈ 2 with constant properties
/// (160–320 cells), a few hundred ms with composition properties; it grows with the total
/// Fourier number α·t/R² of the run (steps are never larger than the base step).
#include <functional>
#include <string>
#include <vector>

#include "coldcore/model/shape.hpp"
#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"
#include "coldcore/properties/composition.hpp"
#include "coldcore/model/thermal.hpp"

namespace coldcore {

/// Temperature-dependent properties as callables of temp_C.
/// REQUIRES: both return finite values > 0 over the temperatures the process reaches
/// (InputError from the solver otherwise, naming the property, temperature and value).
struct NumericMaterial {
  std::function<double(double temp_C)> conductivity_W_mK;
  std::function<double(double temp_C)> volumetric_heat_capacity_J_m3K;  ///< ρ·cp (apparent)
  /// Optional: volumetric enthalpy H(T) (J/m³, any reference) with dH/dT = ρcp. Set it for
  /// phase change: node energies then use the chord (H(b) − H(a))/(b − a) exactly instead of the
  /// quadrature of ρcp, so a latent-heat peak is neither missed nor double-counted, and the
  /// self-check assumes first-order convergence (the enthalpy kink is not smooth).
  std::function<double(double temp_C)> volumetric_enthalpy_J_m3;
  /// The inverse of volumetric_enthalpy_J_m3. REQUIRES: set whenever the enthalpy is set.
  std::function<double(double enthalpy_J_m3)> temperature_from_enthalpy_C;
};

/// Constant k and ρcp.
NumericMaterial constant_material(const ThermalProperties& p);

/// k(T) and ρ(T)·cp(T) from composition_properties (Choi–Okos + ASHRAE mixing). Unfrozen only:
/// a temperature below 0 °C or above 150 °C during the solve throws InputError from
/// composition_properties. The composition is validated here.
NumericMaterial composition_material(const Composition& c, std::string origin = "composition");

/// A simple freezing/thawing model: frozen and unfrozen properties with the latent heat released
/// uniformly over a band of width band_K centred on freezing_C (k and ρcp blend linearly across
/// the band). It is NOT a food ice-fraction curve (real foods freeze gradually below their
/// initial freezing point); use it for products whose freezing range is narrow, or build your
/// own H(T) from a published ice-fraction model. Checked against Neumann's exact solution
/// (tests/reference/neumann_check.csv): with band_K = 0.25 and tol_K = 0.01 the profile is
/// within 0.08 K and the heat removed within 0.02 %.
struct PhaseChangeProperties {
  double frozen_conductivity_W_mK = 0;
  double unfrozen_conductivity_W_mK = 0;
  double frozen_volumetric_heat_capacity_J_m3K = 0;    ///< ρ·cp of the frozen product
  double unfrozen_volumetric_heat_capacity_J_m3K = 0;  ///< ρ·cp of the unfrozen product
  double latent_heat_J_m3 = 0;   ///< ρ·(latent heat per kg of product), e.g. 1050 × 230e3
  double freezing_C = 0;         ///< centre of the freezing band
  double band_K = 1.0;           ///< > 0; narrower is closer to isothermal freezing, needs finer grids
};

/// REQUIRES: all values finite, conductivities and capacities > 0, latent heat >= 0, band > 0;
/// InputError ("phase change: <key> = <value>: must be ...") otherwise.
NumericMaterial phase_change_material(const PhaseChangeProperties& p);

/// One interval of the process with a fixed surface coefficient.
struct NumericSegment {
  double duration_s = 0;       ///< > 0
  double h_W_m2K = 0;          ///< > 0 unless h_infinite
  bool h_infinite = false;     ///< surface held at the medium temperature
  MediumProfile medium;        ///< time from the segment's start; REQUIRES: points non-empty
};

struct NumericProblem {
  Geometry geometry = Geometry::sphere;
  double half_size_m = 0;      ///< slab half-thickness or radius; > 0
  double initial_C = 0;        ///< uniform initial temperature
  NumericMaterial material;
  std::vector<NumericSegment> segments;  ///< consecutive, starting at t = 0; at least one
};

struct NumericOptions {
  /// Target error (K) of every reported temperature, estimated by the Richardson self-check.
  double tol_K = 0.002;
  /// Cells at level 0. Level ℓ uses base_cells·2^ℓ cells.
  int base_cells = 10;
  /// Base (level-0) step as a Fourier number α_ref·Δt/R², α_ref = k/ρcp at the initial
  /// temperature; level ℓ uses steps 2^ℓ times smaller.
  double base_fourier_step = 0.02;
  /// Highest level tried before NotConverged (level 7: 1280 cells by default).
  int max_level = 7;
  /// > 0: skip the self-check and solve once at exactly this many cells with the base step
  /// divided by fixed_step_divisor (for convergence studies). error_estimate_K is then 0.
  int fixed_cells = 0;
  int fixed_step_divisor = 1;
  /// Picard iteration: stop when the largest change of a node temperature is below this (K).
  double picard_tol_K = 1e-10;
  int picard_max_iter = 50;
  /// Iteration cap of the phase-change (enthalpy) iteration, which converges linearly while a
  /// node sits in the latent band; its tolerance is picard_tol_K.
  int enthalpy_max_iter = 1000;
};

/// Temperatures at one requested time (time from the start of the first segment).
struct NumericSample {
  double time_s = 0;
  double medium_C = 0;     ///< medium temperature at time_s (the later segment's at a boundary)
  double centre_C = 0;
  double surface_C = 0;
  double mean_C = 0;       ///< volume average (= mass average for a uniform density)
  double heat_in_J_m2 = 0; ///< heat that entered through the surface since t = 0, per m² of surface
};

struct NumericResult {
  std::vector<NumericSample> samples;  ///< one per requested time, same order
  int cells = 0;                        ///< cells of the returned solution
  long steps = 0;                       ///< time steps of the returned solution
  double error_estimate_K = 0;          ///< Richardson estimate of the returned solution's error
  /// Profile of the returned solution at the latest requested time (the end of the process if
  /// none was requested): node positions (m from the centre) and temperatures.
  std::vector<double> node_r_m;
  std::vector<double> node_T_C;
};

/// Solves the problem and reports the temperatures at output_times_s.
/// Marches from t = 0 to the latest requested time only.
/// REQUIRES: 0 <= each output time <= total duration (any order, repeats allowed);
/// problem fields as documented. InputError on bad input ("numeric: <key> = <value>: <rule>"),
/// NotConverged if the self-check or Picard iteration cannot reach its tolerance.
/// Accuracy: the reported temperatures are within tol_K by the self-check estimate (see above
/// for the measured agreement with outside references).
NumericResult solve_numeric(const NumericProblem& problem, const std::vector<double>& output_times_s,
                            const NumericOptions& options = {});

}  // namespace coldcore
