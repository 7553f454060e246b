#pragma once
// The short-time forms of the step response (short_time.cpp), for series.cpp: θ at a point
// (slab; sphere for x >= 0.5) and the mean θ (slab, sphere) at small Fourier numbers, each with
// its error bound. NotConverged where no form covers the case or the bound exceeds tol.
#include "coldcore/conduction/series.hpp"

namespace coldcore::detail {

StepResponse short_time_point(Geometry g, double biot, double fourier, double x, double tol, int max_terms,
                              const char* where);
StepResponse short_time_mean(Geometry g, double biot, double fourier, double tol, int max_terms,
                             const char* where);

}  // namespace coldcore::detail
