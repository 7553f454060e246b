#include "coldcore/io/quantity.hpp"

#include <algorithm>
#include <array>
#include <cctype>

namespace coldcore::io {

namespace {
constexpr std::array<std::string_view, 2> kTemperature = {"C", "F"};
constexpr std::array<std::string_view, 5> kLength = {"m", "mm", "cm", "in", "ft"};
constexpr std::array<std::string_view, 3> kTime = {"s", "min", "h"};
constexpr std::array<std::string_view, 2> kConductivity = {"W_mK", "Btu_hftF"};
constexpr std::array<std::string_view, 2> kDensity = {"kg_m3", "lb_ft3"};
constexpr std::array<std::string_view, 2> kSpecificHeat = {"J_kgK", "Btu_lbF"};
constexpr std::array<std::string_view, 2> kHeatTransfer = {"W_m2K", "Btu_hft2F"};

// US customary units from their exact definitions: the international foot (0.3048 m) and
// pound (0.45359237 kg) of 1959, the International Table Btu (1055.05585262 J) and the
// Fahrenheit degree (5/9 K). NIST SP 811 (2008), Appendix B, lists the same factors rounded.
constexpr double kFoot_m = 0.3048;
constexpr double kInch_m = 0.0254;
constexpr double kPound_kg = 0.45359237;
constexpr double kBtu_J = 1055.05585262;
constexpr double kFahrenheitDegree_K = 5.0 / 9.0;
constexpr double kHour_s = 3600.0;

}  // namespace

std::span<const std::string_view> unit_suffixes(Quantity q) {
  switch (q) {
    case Quantity::temperature:
    case Quantity::temperature_difference: return kTemperature;
    case Quantity::length: return kLength;
    case Quantity::time: return kTime;
    case Quantity::conductivity: return kConductivity;
    case Quantity::density: return kDensity;
    case Quantity::specific_heat: return kSpecificHeat;
    case Quantity::heat_transfer_coefficient: return kHeatTransfer;
  }
  return {};
}

std::optional<double> to_si(Quantity q, double value, std::string_view unit) {
  switch (q) {
    case Quantity::temperature:
      if (unit == "C") return value;
      if (unit == "F") return (value - 32.0) / 1.8;
      break;
    case Quantity::temperature_difference:
      // A difference of 1.8 °F is 1 K: no offset (z-values, REFERENCES.md conventions).
      if (unit == "C") return value;
      if (unit == "F") return value / 1.8;
      break;
    case Quantity::length:
      if (unit == "m") return value;
      if (unit == "mm") return value / 1000.0;
      if (unit == "cm") return value / 100.0;
      if (unit == "in") return value * kInch_m;
      if (unit == "ft") return value * kFoot_m;
      break;
    case Quantity::time:
      if (unit == "s") return value;
      if (unit == "min") return value * 60.0;
      if (unit == "h") return value * 3600.0;
      break;
    case Quantity::conductivity:
      if (unit == "W_mK") return value;
      if (unit == "Btu_hftF") return value * (kBtu_J / (kHour_s * kFoot_m * kFahrenheitDegree_K));
      break;
    case Quantity::density:
      if (unit == "kg_m3") return value;
      if (unit == "lb_ft3") return value * (kPound_kg / (kFoot_m * kFoot_m * kFoot_m));
      break;
    case Quantity::specific_heat:
      if (unit == "J_kgK") return value;
      if (unit == "Btu_lbF") return value * (kBtu_J / (kPound_kg * kFahrenheitDegree_K));
      break;
    case Quantity::heat_transfer_coefficient:
      if (unit == "W_m2K") return value;
      if (unit == "Btu_hft2F") return value * (kBtu_J / (kHour_s * kFoot_m * kFoot_m * kFahrenheitDegree_K));
      break;
  }
  return std::nullopt;
}

std::string_view unit_text(std::string_view suffix) {
  static constexpr std::array<std::pair<std::string_view, std::string_view>, 8> kShown = {{
      {"W_mK", "W/(m K)"}, {"Btu_hftF", "Btu/(h ft F)"}, {"kg_m3", "kg/m3"}, {"lb_ft3", "lb/ft3"},
      {"J_kgK", "J/(kg K)"}, {"Btu_lbF", "Btu/(lb F)"}, {"W_m2K", "W/(m2 K)"}, {"Btu_hft2F", "Btu/(h ft2 F)"}}};
  for (const auto& [written, shown] : kShown)
    if (suffix == written) return shown;
  return suffix;
}

std::string_view quantity_name(Quantity q) {
  switch (q) {
    case Quantity::temperature: return "temperature";
    case Quantity::temperature_difference: return "temperature difference";
    case Quantity::length: return "length";
    case Quantity::time: return "time";
    case Quantity::conductivity: return "thermal conductivity";
    case Quantity::density: return "density";
    case Quantity::specific_heat: return "specific heat";
    case Quantity::heat_transfer_coefficient: return "surface heat-transfer coefficient";
  }
  return "quantity";
}

std::string_view si_unit(Quantity q) {
  switch (q) {
    case Quantity::temperature:
    case Quantity::temperature_difference: return "C";
    case Quantity::length: return "m";
    case Quantity::time: return "s";
    case Quantity::conductivity: return "W/(m K)";
    case Quantity::density: return "kg/m3";
    case Quantity::specific_heat: return "J/(kg K)";
    case Quantity::heat_transfer_coefficient: return "W/(m2 K)";
  }
  return "";
}

}  // namespace coldcore::io
