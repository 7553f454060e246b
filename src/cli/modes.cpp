// coldcore modes: eigenvalues ζn and coefficients Cn of the series, for teaching and checking.
#include <cmath>
#include <ostream>
#include <limits>

#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"
#include "coldcore/report/reference_tables.hpp"

namespace coldcore::cli {

namespace {

struct ModesArgs {
  std::string shape = "sphere";
  std::string biot = "1";
  int count = 6;
  OutputArgs output;
};

Geometry parse_geometry(const std::string& s) {
  if (s == "sphere") return Geometry::sphere;
  if (s == "cylinder") return Geometry::cylinder;
  if (s == "slab") return Geometry::slab;
  throw InputError("--shape = " + s + ": must be sphere, cylinder or slab");
}

double parse_biot(const std::string& s) {
  if (s == "inf" || s == "infinity" || s == "Inf") return kInfiniteBiot;
  size_t used = 0;
  double b = std::numeric_limits<double>::quiet_NaN();
  try {
    b = std::stod(s, &used);
  } catch (const std::exception&) {
    used = 0;
  }
  if (used != s.size() || !std::isfinite(b))
    throw InputError("--biot = " + s + ": must be a number from 1e-6 up, or inf");
  if (b < 1e-6) throw InputError("--biot = " + s + ": must be >= 1e-6 (or inf)");
  return b;
}

int modes_table(const ModesArgs& a, std::ostream& out) {
  const Geometry g = parse_geometry(a.shape);
  const double biot = parse_biot(a.biot);
  if (a.count < 1 || a.count > 2000)
    throw InputError("--count = " + std::to_string(a.count) + ": must be from 1 to 2000");
  const Format f = output_format(a.output);
  // Two modes at least, for the one-term note.
  const std::vector<Mode> all = modes(g, biot, std::max(a.count, 2));
  ModesTable table{g, biot, std::vector<Mode>(all.begin(), all.begin() + a.count), one_term_fourier(all)};
  write_modes_table(table, f, parse_temp_unit(a.output.units), out);
  return kAllMet;
}

// A reference table: no terminal note, nothing goes to `err`.
int run_modes(const ModesArgs& a, std::ostream& out, std::ostream& /*err*/) {
  return with_output(a.output, out, [&](std::ostream& table) { return modes_table(a, table); });
}

}  // namespace

void add_modes_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<ModesArgs>();
  auto* sub = app.add_subcommand("modes", "eigenvalues and coefficients of the series (teaching)");
  sub->add_option("--shape", args->shape, "sphere | cylinder | slab")->required();
  sub->add_option("--biot", args->biot, "Biot number h·L/k (L: half-thickness or radius), or inf")->required();
  sub->add_option("--count", args->count, "how many modes, 1 to 2000")->capture_default_str();
  add_output_options(*sub, args->output, {Format::text, Format::json, Format::csv});
  sub->callback([&ctx, args] {
    ctx.run = [args](std::ostream& out, std::ostream& err) { return run_modes(*args, out, err); };
  });
}

}  // namespace coldcore::cli
