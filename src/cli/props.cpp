// coldcore props --composition water=0.68,protein=0.2,...: properties versus temperature.
#include <cstdio>
#include <iostream>
#include <sstream>

#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/properties/composition.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"

namespace coldcore::cli {

namespace {

struct PropsArgs {
  std::string composition;
  double from_C = 0;
  double to_C = 100;
  double step_C = 10;
  OutputArgs output;
};

double parse_fraction(const std::string& key, const std::string& text) {
  size_t used = 0;
  double v = 0;
  try {
    v = std::stod(text, &used);
  } catch (const std::exception&) {
    used = 0;
  }
  if (used != text.size() || text.empty())
    throw InputError("--composition " + key + " = " + text + ": must be a mass fraction from 0 to 1");
  return v;
}

Composition parse_composition(const std::string& s) {
  Composition c;
  std::stringstream ss(s);
  std::string item;
  while (std::getline(ss, item, ',')) {
    const auto eq = item.find('=');
    if (eq == std::string::npos)
      throw InputError("--composition = " + s + ": must be name=fraction pairs separated by commas");
    const std::string key = item.substr(0, eq), val = item.substr(eq + 1);
    const double x = parse_fraction(key, val);
    if (key == "water") c.water = x;
    else if (key == "protein") c.protein = x;
    else if (key == "fat") c.fat = x;
    else if (key == "carbohydrate") c.carbohydrate = x;
    else if (key == "fiber" || key == "fibre") c.fiber = x;
    else if (key == "ash") c.ash = x;
    else
      throw InputError("--composition " + key + ": unknown component; must be water, protein, fat, carbohydrate, fiber or ash");
  }
  validate_composition(c, "--composition");
  return c;
}

int run_props(const PropsArgs& a, std::ostream& out) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  const Composition c = parse_composition(a.composition);
  const auto rows = composition_table(c, a.from_C, a.to_C, a.step_C, "props");
  const std::string source =
      "Choi & Okos (1986) component polynomials with the ASHRAE mixing rules (ASHRAE Handbook—Refrigeration, "
      "Thermal Properties of Foods); unfrozen food only; accuracy that of the fits (a few per cent)";
  const std::string us(unit_suffix(u));
  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    w.key("composition").begin_object();
    w.key("water").value(c.water).key("protein").value(c.protein).key("fat").value(c.fat);
    w.key("carbohydrate").value(c.carbohydrate).key("fiber").value(c.fiber).key("ash").value(c.ash);
    w.end_object();
    w.key("source").value(source);
    w.key("rows").begin_array();
    for (const auto& r : rows) {
      w.begin_object();
      w.key("temp_" + us).value(display_temp(r.temp_C, u));
      w.key("conductivity_W_mK").value(r.conductivity_W_mK);
      w.key("density_kg_m3").value(r.density_kg_m3);
      w.key("specific_heat_J_kgK").value(r.specific_heat_J_kgK);
      w.key("diffusivity_m2_s").value(r.diffusivity_m2_s);
      w.end_object();
    }
    w.end_array();
    w.key("cautions").value(cautions());
    w.end_object();
  } else if (f == Format::csv) {
    for (const auto& cau : cautions()) out << "# caution: " << cau << "\n";
    out << "# source: " << source << "\n";
    out << "temp_" << us << ",conductivity_W_mK,density_kg_m3,specific_heat_J_kgK,diffusivity_m2_s\n";
    for (const auto& r : rows)
      out << JsonWriter::number(display_temp(r.temp_C, u)) << "," << JsonWriter::number(r.conductivity_W_mK) << ","
          << JsonWriter::number(r.density_kg_m3) << "," << JsonWriter::number(r.specific_heat_J_kgK) << ","
          << JsonWriter::number(r.diffusivity_m2_s) << "\n";
  } else {
    out << "Thermal properties from composition\n  source: " << source << "\n\n";
    char buf[160];
    std::snprintf(buf, sizeof buf, "  %8s  %10s  %10s  %12s  %14s\n", ("temp_" + us).c_str(),
                  "k W/mK", "rho kg/m3", "cp J/kgK", "alpha e-7 m2/s");
    out << buf;
    for (const auto& r : rows) {
      std::snprintf(buf, sizeof buf, "  %8.2f  %10.4f  %10.1f  %12.1f  %14.4f\n", display_temp(r.temp_C, u),
                    r.conductivity_W_mK, r.density_kg_m3, r.specific_heat_J_kgK, r.diffusivity_m2_s * 1e7);
      out << buf;
    }
    out << "\nCAUTIONS\n";
    for (const auto& cau : cautions()) out << "  * " << cau << "\n";
  }
  return kAllMet;
}

}  // namespace

void add_props_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<PropsArgs>();
  auto* sub = app.add_subcommand("props", "thermal properties versus temperature from a composition");
  sub->add_option("--composition", args->composition,
                  "mass fractions, e.g. water=0.74,protein=0.22,fat=0.03,ash=0.01")->required();
  sub->add_option("--from-C", args->from_C, "lowest temperature, °C")->capture_default_str()->check(within(limits::temperature_C.low, limits::temperature_C.high, "C"));
  sub->add_option("--to-C", args->to_C, "highest temperature, °C")->capture_default_str()->check(within(limits::temperature_C.low, limits::temperature_C.high, "C"));
  sub->add_option("--step-C", args->step_C, "temperature step, °C")->capture_default_str()->check(within(0, 600, "C", true));
  add_output_options(*sub, args->output, {Format::text, Format::json, Format::csv});
  sub->callback([&ctx, args] {
    ctx.run = [args] { return with_output(args->output, [&](std::ostream& out) { return run_props(*args, out); }); };
  });
}

}  // namespace coldcore::cli
