// coldcore props --composition water=0.68,protein=0.2,...: properties versus temperature.
#include <ostream>
#include <sstream>

#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/properties/composition.hpp"
#include "coldcore/report/reference_tables.hpp"

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

int props_table(const PropsArgs& a, std::ostream& out) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  const Composition c = parse_composition(a.composition);
  const auto rows = composition_table(c, a.from_C, a.to_C, a.step_C, "props");
  write_properties_table({c, rows}, f, u, out);
  return kAllMet;
}

// A reference table: no terminal note, nothing goes to `err`.
int run_props(const PropsArgs& a, std::ostream& out, std::ostream& /*err*/) {
  return with_output(a.output, out, [&](std::ostream& table) { return props_table(a, table); });
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
    ctx.run = [args](std::ostream& out, std::ostream& err) { return run_props(*args, out, err); };
  });
}

}  // namespace coldcore::cli
