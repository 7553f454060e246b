// Property callables for the finite-volume solver.
#include <algorithm>
#include <cmath>
#include <memory>
#include <sstream>

#include "coldcore/error.hpp"

#include "coldcore/conduction/numeric.hpp"
#include "properties/detail/mixing.hpp"

namespace coldcore {

NumericMaterial constant_material(const ThermalProperties& p) {
  const double k = p.conductivity_W_mK;
  const double c = p.density_kg_m3 * p.specific_heat_J_kgK;
  return {[k](double) { return k; }, [c](double) { return c; }, {}, {}};
}

NumericMaterial composition_material(const Composition& c, std::string origin) {
  validate_composition(c, origin);
  // Shared so the two callables (and their copies) keep one origin string alive.
  auto where = std::make_shared<const std::string>(std::move(origin));
  // The composition is checked once here; per call only the temperature range is checked (via
  // composition_properties on the rare out-of-range path, so the message is the same).
  auto props = [c, where](double t) {
    if (!(t >= 0.0 && t <= choi_okos_max_C)) return composition_properties(c, t, *where);
    return detail::mix_unchecked(c, t);
  };
  return {[props](double t) { return props(t).conductivity_W_mK; },
          [props](double t) {
            const ThermalProperties p = props(t);
            return p.density_kg_m3 * p.specific_heat_J_kgK;
          },
          {},
          {}};
}

namespace {
void require(bool ok, const char* key, double value, const char* rule) {
  if (!ok) {
    std::ostringstream m;
    m << "phase change: " << key << " = " << value << ": " << rule;
    throw InputError(m.str());
  }
}
}  // namespace

NumericMaterial phase_change_material(const PhaseChangeProperties& p) {
  auto positive = [](double v) { return std::isfinite(v) && v > 0; };
  require(positive(p.frozen_conductivity_W_mK), "frozen_conductivity_W_mK", p.frozen_conductivity_W_mK, "must be > 0");
  require(positive(p.unfrozen_conductivity_W_mK), "unfrozen_conductivity_W_mK", p.unfrozen_conductivity_W_mK, "must be > 0");
  require(positive(p.frozen_volumetric_heat_capacity_J_m3K), "frozen_volumetric_heat_capacity_J_m3K",
          p.frozen_volumetric_heat_capacity_J_m3K, "must be > 0");
  require(positive(p.unfrozen_volumetric_heat_capacity_J_m3K), "unfrozen_volumetric_heat_capacity_J_m3K",
          p.unfrozen_volumetric_heat_capacity_J_m3K, "must be > 0");
  require(std::isfinite(p.latent_heat_J_m3) && p.latent_heat_J_m3 >= 0, "latent_heat_J_m3",
          p.latent_heat_J_m3, "must be >= 0");
  require(std::isfinite(p.freezing_C), "freezing_C", p.freezing_C, "must be finite");
  require(positive(p.band_K), "band_K", p.band_K, "must be > 0");
  const double lo = p.freezing_C - 0.5 * p.band_K, w = p.band_K;
  const double ks = p.frozen_conductivity_W_mK, kl = p.unfrozen_conductivity_W_mK;
  const double cs = p.frozen_volumetric_heat_capacity_J_m3K, cl = p.unfrozen_volumetric_heat_capacity_J_m3K;
  const double latent = p.latent_heat_J_m3;
  NumericMaterial m;
  m.conductivity_W_mK = [=](double t) {
    const double s = std::clamp((t - lo) / w, 0.0, 1.0);
    return ks + (kl - ks) * s;
  };
  m.volumetric_heat_capacity_J_m3K = [=](double t) {
    if (t <= lo) return cs;
    if (t >= lo + w) return cl;
    return cs + (cl - cs) * (t - lo) / w + latent / w;
  };
  // H = ∫ ρcp dT from the band's lower edge, piecewise exact.
  m.volumetric_enthalpy_J_m3 = [=](double t) {
    const double s = t - lo;
    if (s <= 0) return cs * s;
    if (s >= w) return cs * w + 0.5 * (cl - cs) * w + latent + cl * (s - w);
    return cs * s + 0.5 * (cl - cs) * s * s / w + latent * s / w;
  };
  const double h_band_top = cs * w + 0.5 * (cl - cs) * w + latent;
  m.temperature_from_enthalpy_C = [=](double h) {
    if (h <= 0) return lo + h / cs;
    if (h >= h_band_top) return lo + w + (h - h_band_top) / cl;
    // In the band: q s² + p s = h with q = (cl − cs)/(2w), p = cs + latent/w > 0; the root
    // written as 2h/(p + √(p² + 4qh)) has no cancellation and holds for q of either sign.
    const double q = 0.5 * (cl - cs) / w, pp = cs + latent / w;
    return lo + 2.0 * h / (pp + std::sqrt(pp * pp + 4.0 * q * h));
  };
  return m;
}

}  // namespace coldcore
