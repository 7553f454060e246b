#include "coldcore/model/product.hpp"

#include <algorithm>

namespace coldcore {

double smallest_half_dimension_m(const Product& p) {
  const Dimensions& d = p.dims;
  switch (p.shape) {
    case Shape::sphere:
    case Shape::cylinder: return d.diameter_m / 2;
    case Shape::finite_cylinder: return std::min(d.diameter_m, d.length_m) / 2;
    case Shape::slab: return d.thickness_m / 2;
    case Shape::brick: return std::min({d.size_m[0], d.size_m[1], d.size_m[2]}) / 2;
  }
  return 0;
}

}  // namespace coldcore
