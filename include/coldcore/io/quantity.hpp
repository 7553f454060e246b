#pragma once
/// Unit-suffixed keys of the product file (`diameter_mm`, `initial_F`, `duration_min`) and their
/// conversion to SI, done once at the input edge. Also the "did you mean" helper for names.
///
/// Accepted suffixes (DESIGN.md, "Product file (TOML), schema 1"):
///   temperature             _C, _F       °F → °C: (F − 32) / 1.8
///   temperature difference  _C, _F       °F → °C: ΔF / 1.8 (z-values; no 32 offset)
///   length                  _m, _mm, _cm, _in, _ft
///   time                    _s, _min, _h
///   thermal conductivity    _W_mK, _Btu_hftF     Btu/(h ft °F)
///   density                 _kg_m3, _lb_ft3
///   specific heat           _J_kgK, _Btu_lbF     Btu/(lb °F)
///   heat-transfer coeff.    _W_m2K, _Btu_hft2F   Btu/(h ft² °F)
/// US customary units convert from their exact definitions (ft, lb, International Table Btu).
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/suggest.hpp"

namespace coldcore::io {

enum class Quantity {
  temperature,
  temperature_difference,
  length,
  time,
  conductivity,
  density,
  specific_heat,
  heat_transfer_coefficient
};

/// The suffixes accepted for a quantity, without the underscore, preferred first
/// (e.g. {"C", "F"}).
std::span<const std::string_view> unit_suffixes(Quantity q);

/// `value` given in `unit` (a suffix of unit_suffixes(q), no underscore) in SI: °C, K (for a
/// temperature difference), m or s. Returns nullopt for a unit the quantity does not accept.
/// Exact arithmetic: one multiply and/or subtract, no rounding beyond the double operations.
std::optional<double> to_si(Quantity q, double value, std::string_view unit);

/// A unit suffix as a unit in messages: "W_mK" -> "W/(m K)", "Btu_hftF" -> "Btu/(h ft F)";
/// suffixes that already read as units ("mm", "min", "C") as they are.
std::string_view unit_text(std::string_view suffix);

/// A human name of the quantity for messages: "temperature", "temperature difference", ...
std::string_view quantity_name(Quantity q);

/// The unit written in messages after conversion, ASCII: "C" (temperatures and temperature
/// differences), "m", "s", "W/(m K)", "kg/m3", "J/(kg K)", "W/(m2 K)".
std::string_view si_unit(Quantity q);

// The one "did you mean" rule (coldcore/suggest.hpp), also spelt io:: for the readers here.
using ::coldcore::did_you_mean;
using ::coldcore::edit_distance;

}  // namespace coldcore::io
