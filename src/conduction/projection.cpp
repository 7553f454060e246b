// Projection of a stage's temperature profile onto the modes of the next stage (new h).
#include <algorithm>
#include <cmath>

#include "conduction/detail/history_engine.hpp"

namespace coldcore::detail {
namespace {

// Dense coefficient tensor over per-axis index ranges (unused axes have size 1).
struct Dense {
  std::array<int, 3> n{1, 1, 1};
  std::vector<double> v;
  double& at(int i, int j, int k) { return v[(static_cast<std::size_t>(i) * n[1] + j) * n[2] + k]; }
};

// Contract axis `ax` of d with the row-major matrix M (rows = d.n[ax], cols = m).
Dense contract(Dense& d, int ax, const std::vector<double>& M, int m) {
  Dense out;
  out.n = d.n;
  out.n[ax] = m;
  out.v.assign(static_cast<std::size_t>(out.n[0]) * out.n[1] * out.n[2], 0.0);
  for (int i = 0; i < d.n[0]; ++i)
    for (int j = 0; j < d.n[1]; ++j)
      for (int k = 0; k < d.n[2]; ++k) {
        const double x = d.at(i, j, k);
        if (x == 0.0) continue;
        const int r = ax == 0 ? i : ax == 1 ? j : k;
        for (int c = 0; c < m; ++c) {
          const double y = x * M[static_cast<std::size_t>(r) * m + c];
          if (ax == 0) out.at(c, j, k) += y;
          else if (ax == 1) out.at(i, c, k) += y;
          else out.at(i, j, c) += y;
        }
      }
  return out;
}

}  // namespace

std::vector<double> project_state(const Basis& from, const ModalState& st, double tm_from, double slope_from,
                                  const Basis& to, double tm_to) {
  const std::size_t na = from.axes.size();
  std::vector<double> out(to.lambda.size(), 0.0);
  // uniform part: (T∞_from − T∞_to)·1 projects onto b
  for (std::size_t l = 0; l < out.size(); ++l) out[l] = (tm_from - tm_to) * to.b[l];

  // Old profile u = Σ_K a_k Φ_k − s·Q(x), Q = Σ_{k∉K} b_k Φ_k/λ_k. In 1D Q = (L²/α)P − Σ_K bΦ/λ
  // and P projects in closed form; in products the left-out part is carried by the product
  // modes up to 2× the kept ζ per axis (4× λ), whose coefficients −s b/λ are exact.
  std::vector<AxisModes> src;
  if (na == 1 || slope_from == 0.0) {
    src = from.axes;
  } else {
    for (const auto& a : from.axes)
      src.push_back(axis_modes(a.geometry, a.biot, a.half_length_m, 2 * static_cast<int>(a.zeta.size()) + 2));
  }
  Dense d;
  for (std::size_t a = 0; a < na; ++a) d.n[a] = static_cast<int>(src[a].zeta.size());
  d.v.assign(static_cast<std::size_t>(d.n[0]) * d.n[1] * d.n[2], 0.0);
  for (std::size_t k = 0; k < from.lambda.size(); ++k) {
    const auto& ix = from.index[k];
    double c = st.a[k];
    if (na == 1) c += slope_from * from.b[k] / from.lambda[k];  // −s·(−Σ_K bΦ/λ)
    d.at(ix[0], ix[1], ix[2]) += c;
  }
  if (na > 1 && slope_from != 0.0) {
    for (int i = 0; i < d.n[0]; ++i)
      for (int j = 0; j < d.n[1]; ++j)
        for (int k = 0; k < d.n[2]; ++k) {
          const int ijk[3] = {i, j, k};
          double lam = 0, b = 1;
          for (std::size_t a = 0; a < na; ++a) {
            lam += src[a].lambda(ijk[a], from.alpha);
            b *= src[a].coef[ijk[a]];
          }
          if (lam <= from.lambda_cut && i < from.dense[0] && (na < 2 || j < from.dense[1]) &&
              (na < 3 || k < from.dense[2]))
            continue;  // kept: already in a_k
          if (lam > 4.0 * from.lambda_cut) continue;
          d.at(i, j, k) += -slope_from * b / lam;
        }
  }
  Dense cur = d;
  for (std::size_t a = 0; a < na; ++a) {
    const auto M = projection_matrix(src[a], to.axes[a]);
    cur = contract(cur, static_cast<int>(a), M, static_cast<int>(to.axes[a].zeta.size()));
  }
  for (std::size_t l = 0; l < out.size(); ++l) {
    const auto& ix = to.index[l];
    out[l] += cur.at(ix[0], ix[1], ix[2]);
  }
  if (na == 1 && slope_from != 0.0) {
    const auto& ax = from.axes[0];
    const auto R = ramp_profile_projection(ax, to.axes[0]);
    const double l2a = ax.half_length_m * ax.half_length_m / from.alpha;
    for (std::size_t l = 0; l < out.size(); ++l) out[l] += -slope_from * l2a * R[to.index[l][0]];
  }
  return out;
}

}  // namespace coldcore::detail
