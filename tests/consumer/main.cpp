// Links the installed coldcore::core and checks one analytic value through its public API:
// sphere, Bi = 1: 1 − ζ cot ζ = 1 gives ζ1 = π/2 exactly (Carslaw & Jaeger §9.8), and the
// centre coefficient C1 = 2(sin ζ − ζ cos ζ)/(ζ − sin ζ cos ζ) = 4/π.
#include <cmath>
#include <cstdio>
#include <numbers>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/version.hpp"

int main() {
  const double zeta = coldcore::eigenvalue(coldcore::Geometry::sphere, 1.0, 1);
  const double c1 = coldcore::centre_coefficient(coldcore::Geometry::sphere, 1.0, zeta);
  const bool ok = std::abs(zeta - std::numbers::pi / 2) < 1e-12 && std::abs(c1 - 4 / std::numbers::pi) < 1e-12;
  std::printf("coldcore %s: zeta1 = %.15f, C1 = %.15f: %s\n", coldcore::kVersion, zeta, c1, ok ? "ok" : "WRONG");
  return ok ? 0 : 1;
}
