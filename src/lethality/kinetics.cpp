#include "coldcore/lethality/kinetics.hpp"

#include <cassert>
#include <cmath>

namespace coldcore {

double lethal_rate(double temp_C, const Kinetics& k) {
  assert(k.z_C > 0);
  if (k.split_C && k.z_below_C && temp_C < *k.split_C) {
    // Below the split the lower z applies, anchored so that L is continuous at split_C.
    const double log_at_split = (*k.split_C - k.reference_C) / k.z_C;
    return std::pow(10.0, log_at_split + (temp_C - *k.split_C) / *k.z_below_C);
  }
  return std::pow(10.0, (temp_C - k.reference_C) / k.z_C);
}

double d_value_s(double temp_C, const Kinetics& k) {
  assert(k.D_ref_s);
  return *k.D_ref_s / lethal_rate(temp_C, k);
}

double equivalent_time_s(double F_ref_s, double temp_C, const Kinetics& k) {
  return F_ref_s / lethal_rate(temp_C, k);
}

double log_reduction_linear(double F_ref_s, const Kinetics& k) {
  assert(k.D_ref_s && *k.D_ref_s > 0);
  return F_ref_s / *k.D_ref_s;
}

double log_reduction_weibull(double F_ref_s, const Kinetics& k) {
  assert(k.weibull && k.weibull->delta_ref_s > 0 && k.weibull->p > 0);
  if (F_ref_s <= 0) return 0.0;
  return std::pow(F_ref_s / k.weibull->delta_ref_s, k.weibull->p);
}

}  // namespace coldcore
