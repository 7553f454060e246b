#pragma once
/// Product shapes and the one-dimensional geometries they are built from.
#include <string>
#include <string_view>

namespace coldcore {

/// The 1D conduction geometries with an exact eigenfunction series.
/// slab: half-thickness L, x = position/L in [0,1] from the mid-plane.
/// cylinder (infinite) and sphere: radius R, x = r/R in [0,1] from the centre.
enum class Geometry { slab, cylinder, sphere };

/// Product shapes of the product file. finite-cylinder = cylinder × slab and
/// brick = slab × slab × slab by Newman's product rule.
enum class Shape { sphere, cylinder, finite_cylinder, slab, brick };

std::string_view to_string(Geometry g);
std::string_view to_string(Shape s);

}  // namespace coldcore
