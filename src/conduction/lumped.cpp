#include "coldcore/conduction/lumped.hpp"

#include <cmath>
#include <sstream>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore {
namespace {

void require(bool ok, const char* where, const char* key, double v, const char* req) {
  if (!ok) throw InputError(std::string(where) + ": " + key + " = " + number_text(v, 17) + ": " + req);
}

}  // namespace

double biot_number(double h_W_m2K, double length_m, double k_W_mK) {
  require(h_W_m2K >= 0 && std::isfinite(h_W_m2K), "biot_number", "h_W_m2K", h_W_m2K, "must be >= 0");
  require(length_m > 0 && std::isfinite(length_m), "biot_number", "length_m", length_m, "must be > 0");
  require(k_W_mK > 0 && std::isfinite(k_W_mK), "biot_number", "k_W_mK", k_W_mK, "must be > 0");
  return h_W_m2K * length_m / k_W_mK;
}

double fourier_number(double alpha_m2_s, double time_s, double length_m) {
  require(alpha_m2_s > 0 && std::isfinite(alpha_m2_s), "fourier_number", "alpha_m2_s", alpha_m2_s, "must be > 0");
  require(time_s >= 0 && std::isfinite(time_s), "fourier_number", "time_s", time_s, "must be >= 0");
  require(length_m > 0 && std::isfinite(length_m), "fourier_number", "length_m", length_m, "must be > 0");
  return alpha_m2_s * time_s / (length_m * length_m);
}

double thermal_diffusivity_m2_s(double k_W_mK, double density_kg_m3, double specific_heat_J_kgK) {
  const char* w = "thermal_diffusivity_m2_s";
  require(k_W_mK > 0 && std::isfinite(k_W_mK), w, "k_W_mK", k_W_mK, "must be > 0");
  require(density_kg_m3 > 0 && std::isfinite(density_kg_m3), w, "density_kg_m3", density_kg_m3, "must be > 0");
  require(specific_heat_J_kgK > 0 && std::isfinite(specific_heat_J_kgK), w, "specific_heat_J_kgK",
          specific_heat_J_kgK, "must be > 0");
  return k_W_mK / (density_kg_m3 * specific_heat_J_kgK);
}

double lumped_length_m(Geometry g, double half_size_m) {
  require(half_size_m > 0 && std::isfinite(half_size_m), "lumped_length_m", "half_size_m", half_size_m,
          "must be > 0");
  return half_size_m / (geometry_exponent(g) + 1);
}

double lumped_biot(Geometry g, double biot) {
  require(biot >= 0, "lumped_biot", "biot", biot, "must be >= 0");
  return biot / (geometry_exponent(g) + 1);
}

double lumped_theta(double biot_lumped, double fourier_lumped) {
  require(biot_lumped >= 0, "lumped_theta", "biot_lumped", biot_lumped, "must be >= 0");
  require(fourier_lumped >= 0, "lumped_theta", "fourier_lumped", fourier_lumped, "must be >= 0");
  return std::exp(-biot_lumped * fourier_lumped);
}

double lumped_theta(Geometry g, double biot, double fourier) {
  require(biot >= 0, "lumped_theta", "biot", biot, "must be >= 0");
  require(fourier >= 0, "lumped_theta", "fourier", fourier, "must be >= 0");
  if (fourier == 0 || biot == 0) return 1.0;  // also avoids ∞·0 at Bi = ∞
  return std::exp(-(geometry_exponent(g) + 1) * biot * fourier);
}

std::string lumped_warning(Geometry g, double biot) {
  const double bc = lumped_biot(g, biot);
  if (bc <= kLumpedBiotLimit) return {};
  const char* lc = g == Geometry::slab ? "L for a slab" : g == Geometry::cylinder ? "R/2 for a long cylinder"
                                                                                    : "R/3 for a sphere";
  return "lumped capacitance with Bi = " + number_text(bc, 3) + " (Lc = V/A = " + lc +
         ") > 0.1: the product is not at a uniform temperature; the centre lags the lumped value, "
         "use the exact series";
}

LumpedComparison compare_lumped(Geometry g, double biot, double fourier, const SeriesOptions& opts) {
  LumpedComparison c;
  c.biot_lumped = lumped_biot(g, biot);
  c.lumped = lumped_theta(g, biot, fourier);
  c.exact_centre = step_response(g, biot, fourier, 0.0, opts);
  c.exact_mean = mean_step_response(g, biot, fourier, opts);
  c.centre_difference = c.lumped - c.exact_centre.theta;
  c.mean_difference = c.lumped - c.exact_mean.theta;
  c.lumped_valid = c.biot_lumped <= kLumpedBiotLimit;
  c.warning = lumped_warning(g, biot);
  return c;
}

}  // namespace coldcore
