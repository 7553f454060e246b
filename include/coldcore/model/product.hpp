#pragma once
/// A product: shape, outer dimensions, uniform initial temperature and thermal properties. All
/// values SI (m, °C, W/(m K), kg/m³, J/(kg K)); unit conversion happens once, in io/.
#include <string>

#include "coldcore/model/shape.hpp"
#include "coldcore/model/thermal.hpp"

namespace coldcore {

/// Outer dimensions of the product (full sizes, not halves).
/// sphere, cylinder: diameter_m. finite-cylinder: diameter_m and length_m. slab: thickness_m.
/// brick: size_m[0..2]. Unused fields stay 0.
struct Dimensions {
  double diameter_m = 0;
  double length_m = 0;
  double thickness_m = 0;
  double size_m[3] = {0, 0, 0};
};

struct Product {
  std::string name;
  Shape shape = Shape::sphere;
  Dimensions dims;
  double initial_C = 0;          ///< uniform initial temperature
  ThermalProperties properties;
};

/// Smallest half-dimension (radius or half-thickness), m: the length of the stage Biot number,
/// and the one the centre's insulated time L²/α is built on.
double smallest_half_dimension_m(const Product& p);

}  // namespace coldcore
