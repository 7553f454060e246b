#include "coldcore/model/shape.hpp"

namespace coldcore {

std::string_view to_string(Geometry g) {
  switch (g) {
    case Geometry::slab: return "slab";
    case Geometry::cylinder: return "cylinder";
    case Geometry::sphere: return "sphere";
  }
  return "?";
}

std::string_view to_string(Shape s) {
  switch (s) {
    case Shape::sphere: return "sphere";
    case Shape::cylinder: return "cylinder";
    case Shape::finite_cylinder: return "finite-cylinder";
    case Shape::slab: return "slab";
    case Shape::brick: return "brick";
  }
  return "?";
}

}  // namespace coldcore
