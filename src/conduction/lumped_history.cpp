#include "coldcore/conduction/lumped_history.hpp"

#include <algorithm>
#include <cmath>

#include "coldcore/error.hpp"

namespace coldcore {

namespace {

// Exact solution of dT/dt = β(T∞ − T) over dt with T∞ linear (value m0, slope s):
// T∞ − T relaxes as e^{−βt} towards the lag s/β.
double advance_lumped(double T, double m0, double s, double beta, double dt) {
  if (dt <= 0) return T;
  const double e = std::exp(-beta * dt);
  const double lag = s / beta;
  return (m0 + s * dt) - lag + (T - m0 + lag) * e;
}

}  // namespace

std::vector<double> lumped_history_C(const Product& product, double volume_to_area_m,
                                     const std::vector<Stage>& stages, const History& history,
                                     const std::vector<double>& times_s) {
  if (!(volume_to_area_m > 0)) throw InputError("lumped_history: volume_to_area_m must be > 0");
  if (stages.size() != history.stages.size())
    throw InputError("lumped_history: stages and history stages differ in number");
  const double rho_c = product.properties.density_kg_m3 * product.properties.specific_heat_J_kgK;
  std::vector<double> out;
  out.reserve(times_s.size());
  double T = product.initial_C;
  double t_now = 0;
  size_t si = 0;
  // March through (stage, medium piece) segments, emitting outputs as they fall inside.
  auto march_to = [&](double t_target) {
    while (t_now < t_target && si < stages.size()) {
      const Stage& st = stages[si];
      const double s0 = history.stages[si].start_s, s1 = history.stages[si].end_s;
      if (t_now >= s1) { ++si; continue; }
      const double local = t_now - s0;
      // next medium breakpoint after `local`
      double next_local = s1 - s0;
      const auto& pts = st.medium.points;
      auto it = std::upper_bound(pts.begin(), pts.end(), local, [](double x, const MediumPoint& p) { return x < p.time_s; });
      if (it != pts.end()) next_local = std::min(next_local, it->time_s);
      const double t_end = std::min({s0 + next_local, s1, t_target});
      const double m0 = st.medium.at(local);
      const double m1 = st.medium.at(t_end - s0);
      const double dt = t_end - t_now;
      if (st.h_infinite) {
        T = m1;
      } else if (dt > 0) {
        const double beta = st.h_W_m2K / (rho_c * volume_to_area_m);
        T = advance_lumped(T, m0, (m1 - m0) / dt, beta, dt);
      }
      t_now = t_end;
      if (t_now >= s1) ++si;
    }
  };
  for (double t : times_s) {
    march_to(t);
    out.push_back(T);
  }
  return out;
}

}  // namespace coldcore
