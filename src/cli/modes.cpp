// coldcore modes: eigenvalues ζn and coefficients Cn of the series, for teaching and checking.
#include <cmath>
#include <iostream>
#include <limits>
#include <sstream>

#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"

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

std::string biot_text(double biot) { return std::isinf(biot) ? "inf" : JsonWriter::number(biot); }

/// Fourier number beyond which the second term at the centre is below 1 % of the first,
/// so the one-term form is good to about 1 % there.
double one_term_fourier(const std::vector<Mode>& m) {
  if (m.size() < 2) return std::numeric_limits<double>::quiet_NaN();
  const double ratio = std::abs(m[1].coefficient / m[0].coefficient);
  const double fo = std::log(100.0 * ratio) / (m[1].zeta * m[1].zeta - m[0].zeta * m[0].zeta);
  return std::max(fo, 0.0);
}

int run_modes(const ModesArgs& a, std::ostream& out) {
  const Geometry g = parse_geometry(a.shape);
  const double biot = parse_biot(a.biot);
  if (a.count < 1 || a.count > 2000)
    throw InputError("--count = " + std::to_string(a.count) + ": must be from 1 to 2000");
  const Format f = output_format(a.output);
  // Two modes at least, for the one-term note.
  const std::vector<Mode> all = modes(g, biot, std::max(a.count, 2));
  const std::vector<Mode> shown(all.begin(), all.begin() + a.count);
  const double fo1 = one_term_fourier(all);
  std::ostringstream note;
  note << "At the centre the second term is below 1 % of the first once Fo > "
       << fixed(fo1, 3) << "; the handbook rule is that one term serves for Fo > 0.2 (within about 2 %).";

  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    w.key("shape").value(to_string(g));
    if (std::isinf(biot)) w.key("biot").value("inf"); else w.key("biot").value(biot);
    w.key("modes").begin_array();
    for (const auto& m : shown) {
      w.begin_object();
      w.key("n").value(m.n).key("zeta").value(m.zeta).key("coefficient").value(m.coefficient);
      w.key("mean_coefficient").value(m.mean_coefficient);
      w.end_object();
    }
    w.end_array();
    w.key("one_term_fourier").value(fo1);
    w.key("note").value(note.str());
    w.key("cautions").value(cautions());
    w.end_object();
  } else if (f == Format::csv) {
    for (const auto& c : cautions()) out << "# caution: " << c << "\n";
    out << "# " << note.str() << "\n";
    out << "n,zeta,coefficient,mean_coefficient\n";
    for (const auto& m : shown)
      out << m.n << "," << JsonWriter::number(m.zeta) << "," << JsonWriter::number(m.coefficient) << ","
          << JsonWriter::number(m.mean_coefficient) << "\n";
  } else {
    out << "Eigenvalues of the " << to_string(g) << " at Bi = " << biot_text(biot) << "\n";
    out << "theta(x, Fo) = sum of Cn Xn(x) exp(-zeta_n^2 Fo); mean theta uses Mn in place of Cn Xn.\n\n";
    char buf[160];
    std::snprintf(buf, sizeof buf, "  %5s  %22s  %22s  %22s\n", "n", "zeta_n", "C_n", "M_n (mean)");
    out << buf;
    for (const auto& m : shown) {
      std::snprintf(buf, sizeof buf, "  %5d  %22.15g  %22.15g  %22.15g\n", m.n, m.zeta, m.coefficient,
                    m.mean_coefficient);
      out << buf;
    }
    out << "\n" << note.str() << "\n\nCAUTIONS\n";
    for (const auto& c : cautions()) out << "  * " << c << "\n";
  }
  return kAllMet;
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
    ctx.run = [args] { return with_output(args->output, [&](std::ostream& out) { return run_modes(*args, out); }); };
  });
}

}  // namespace coldcore::cli
