#include "coldcore/io/calibration_file.hpp"

#include <cmath>
#include <sstream>

#include "coldcore/error.hpp"
#include "io/detail/fields.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

using detail::Fields;
using detail::plain;

namespace {

std::array<double, 2> pair_of(const Fields& f, std::string_view key) {
  const toml::node* n = f.node(key);
  if (n == nullptr) f.missing(key, "[low, high]");
  const toml::array* a = n->as_array();
  if (a == nullptr || a->size() != 2) f.fail(key, "must be [low, high]");
  const double lo = f.number_of(key, *a->get(0)), hi = f.number_of(key, *a->get(1));
  if (!(lo > 0 && lo <= hi)) f.fail(key, "must be [low, high] with 0 < low <= high");
  return {lo, hi};
}

double positive(const Fields& f, std::string_view key) {
  const toml::node* n = f.node(key);
  if (n == nullptr) f.missing(key, "a number > 0");
  const double v = f.number_of(key, *n);
  if (!(v > 0)) f.fail(key, "must be > 0");
  return v;
}

int count(const Fields& f, std::string_view key, int min) {
  const toml::node* n = f.node(key);
  if (n == nullptr || !n->is_integer()) f.fail(key, "must be an integer >= " + std::to_string(min));
  const auto v = n->as_integer()->get();
  if (v < min || v > 100000000) f.fail(key, "must be an integer >= " + std::to_string(min));
  return static_cast<int>(v);
}

std::vector<std::string> strings(const Fields& f, std::string_view key) {
  std::vector<std::string> out;
  const toml::node* n = f.node(key);
  if (n == nullptr) return out;
  const toml::array* a = n->as_array();
  if (a == nullptr) f.fail(key, "must be an array of strings");
  for (const auto& e : *a) {
    if (!e.is_string()) f.fail(key, "must be an array of strings");
    out.push_back(e.as_string()->get());
  }
  return out;
}

const char* status_key(CalibratedHStatus s) {
  switch (s) {
    case CalibratedHStatus::fitted: return "fitted";
    case CalibratedHStatus::lower_bound: return "lower_bound";
    case CalibratedHStatus::not_identified: return "not_identified";
  }
  return "fitted";
}

/// TOML text of a table: its plain values first, then sub-tables and arrays of tables.
void emit(std::ostream& o, const toml::table& t, const std::string& path) {
  for (auto&& [k, v] : t) {
    if (v.is_table()) continue;
    if (const toml::array* a = v.as_array(); a && a->is_array_of_tables()) continue;
    o << k.str() << " = " << detail::format_value(v) << "\n";
  }
  for (auto&& [k, v] : t) {
    const std::string sub = path.empty() ? std::string(k.str()) : path + "." + std::string(k.str());
    if (const toml::table* tt = v.as_table()) {
      o << "\n[" << sub << "]\n";
      emit(o, *tt, sub);
    } else if (const toml::array* a = v.as_array(); a && a->is_array_of_tables() && !a->empty()) {
      for (const auto& e : *a) {
        o << "\n[[" << sub << "]]\n";
        emit(o, *e.as_table(), sub);
      }
    }
  }
}

toml::array number_pair(const std::array<double, 2>& p) { return toml::array{p[0], p[1]}; }

}  // namespace

Calibration parse_calibration(const toml::table& t, const std::string& origin) {
  Fields f(t, origin, "calibration",
           {plain("alpha_m2_s"), plain("alpha_ci95_m2_s"), plain("covariance_log"), plain("dof"), plain("rms_K"),
            plain("n_points"), plain("design_probe"), plain("date"), plain("study"), plain("h")});
  Calibration c;
  c.alpha_m2_s = positive(f, "alpha_m2_s");
  c.alpha_ci95_m2_s = pair_of(f, "alpha_ci95_m2_s");
  if (!(c.alpha_ci95_m2_s[0] <= c.alpha_m2_s && c.alpha_m2_s <= c.alpha_ci95_m2_s[1]))
    f.fail("alpha_ci95_m2_s", "must contain alpha_m2_s");
  c.dof = count(f, "dof", 1);
  c.n_points = count(f, "n_points", 1);
  c.rms_K = positive(f, "rms_K");
  c.design_probe = f.string("design_probe").value_or("");
  c.date = f.string("date").value_or("");
  c.study = strings(f, "study");
  if (const toml::node* h = f.node("h")) {
    const toml::array* a = h->as_array();
    if (a == nullptr || !a->is_array_of_tables()) f.fail("h", "must be an array of tables [[calibration.h]]");
    for (std::size_t i = 0; i < a->size(); ++i) {
      Fields g(*a->get(i)->as_table(), origin, "calibration.h[" + std::to_string(i + 1) + "]",
               {plain("stages"), plain("status"), plain("h_W_m2K"), plain("ci95_W_m2K")});
      CalibratedH ch;
      ch.stages = strings(g, "stages");
      if (ch.stages.empty()) g.missing("stages", "the names of the stages this h belongs to");
      const std::string st = g.string("status").value_or("fitted");
      if (st == "fitted") ch.status = CalibratedHStatus::fitted;
      else if (st == "lower_bound") ch.status = CalibratedHStatus::lower_bound;
      else if (st == "not_identified") ch.status = CalibratedHStatus::not_identified;
      else g.fail("status", "must be \"fitted\", \"lower_bound\" or \"not_identified\"");
      ch.h_W_m2K = positive(g, "h_W_m2K");
      if (ch.status == CalibratedHStatus::fitted) {
        ch.ci95_W_m2K = pair_of(g, "ci95_W_m2K");
        if (!(ch.ci95_W_m2K[0] <= ch.h_W_m2K && ch.h_W_m2K <= ch.ci95_W_m2K[1])) g.fail("ci95_W_m2K", "must contain h_W_m2K");
      }
      c.h.push_back(std::move(ch));
    }
  }
  const std::size_t p = c.parameters();
  const toml::node* cov = f.node("covariance_log");
  if (cov == nullptr) f.missing("covariance_log", "the " + std::to_string(p) + " x " + std::to_string(p) + " covariance");
  const toml::array* rows = cov->as_array();
  const std::string shape = "must be a symmetric " + std::to_string(p) + " x " + std::to_string(p) +
                            " matrix (ln alpha and each fitted h) with a non-negative diagonal";
  if (rows == nullptr || rows->size() != p) f.fail("covariance_log", shape);
  for (std::size_t i = 0; i < p; ++i) {
    const toml::array* r = rows->get(i)->as_array();
    if (r == nullptr || r->size() != p) f.fail("covariance_log", shape);
    std::vector<double> row;
    for (std::size_t j = 0; j < p; ++j) row.push_back(f.number_of("covariance_log", *r->get(j)));
    c.covariance_log.push_back(row);
  }
  for (std::size_t i = 0; i < p; ++i) {
    if (c.covariance_log[i][i] < 0) f.fail("covariance_log", shape);
    for (std::size_t j = 0; j < i; ++j) {
      const double a = c.covariance_log[i][j], b = c.covariance_log[j][i];
      if (std::abs(a - b) > 1e-12 * (std::abs(a) + std::abs(b)) + 1e-300) f.fail("covariance_log", shape);
    }
  }
  return c;
}

void check_calibration(const Calibration& c, const Product& p, const std::vector<Stage>& stages, const std::string& origin) {
  const double alpha = p.properties.diffusivity_m2_s();
  if (std::abs(alpha - c.alpha_m2_s) > 1e-6 * c.alpha_m2_s)
    throw InputError(origin + ": calibration.alpha_m2_s = " + detail::format_number(c.alpha_m2_s) +
                     ": the file's properties give alpha = " + detail::format_number(alpha) +
                     "; the calibration no longer describes this product: fit again or remove [calibration]");
  for (std::size_t g = 0; g < c.h.size(); ++g)
    for (const std::string& name : c.h[g].stages) {
      std::size_t i = 0;
      while (i < stages.size() && stages[i].name != name) ++i;
      const std::string key = "calibration.h[" + std::to_string(g + 1) + "].stages";
      if (i == stages.size())
        throw InputError(origin + ": " + key + " = " + detail::quote(name) + ": no stage has this name");
      if (stages[i].h_infinite || std::abs(stages[i].h_W_m2K - c.h[g].h_W_m2K) > 1e-9 * c.h[g].h_W_m2K)
        throw InputError(origin + ": stage[" + std::to_string(i + 1) + "].h_W_m2K = " +
                         detail::format_number(stages[i].h_W_m2K) + ": the calibration gives " +
                         detail::format_number(c.h[g].h_W_m2K) +
                         " for this stage; fit again or remove [calibration]");
    }
}

std::string calibrated_product_toml(std::string_view original, const Calibration& c, double rho_cp_J_m3K) {
  toml::table doc = toml::parse(original);
  toml::table& product = *doc["product"].as_table();
  const double k = c.alpha_m2_s * rho_cp_J_m3K;
  product["properties"].as_table()->insert_or_assign("conductivity_W_mK", k);
  if (!product.contains("ranges")) product.insert("ranges", toml::table{});
  product["ranges"].as_table()->insert_or_assign(
      "conductivity_W_mK", toml::array{c.alpha_ci95_m2_s[0] * rho_cp_J_m3K, c.alpha_ci95_m2_s[1] * rho_cp_J_m3K});
  if (toml::array* st = doc["stage"].as_array()) {
    for (auto& node : *st) {
      toml::table& s = *node.as_table();
      const std::string name = s["name"].value_or(std::string());
      for (const CalibratedH& g : c.h) {
        if (std::find(g.stages.begin(), g.stages.end(), name) == g.stages.end()) continue;
        s.erase("medium_type");
        s.insert_or_assign("h_W_m2K", g.h_W_m2K);
        if (g.status == CalibratedHStatus::fitted) s.insert_or_assign("h_range_W_m2K", number_pair(g.ci95_W_m2K));
        else s.erase("h_range_W_m2K");
      }
    }
  }
  toml::table cal;
  cal.insert("alpha_m2_s", c.alpha_m2_s);
  cal.insert("alpha_ci95_m2_s", number_pair(c.alpha_ci95_m2_s));
  toml::array cov;  // written exactly symmetric (the solver's product may differ in the last bit)
  for (std::size_t i = 0; i < c.covariance_log.size(); ++i) {
    toml::array r;
    for (std::size_t j = 0; j < c.covariance_log.size(); ++j)
      r.push_back(0.5 * (c.covariance_log[i][j] + c.covariance_log[j][i]));
    cov.push_back(std::move(r));
  }
  cal.insert("covariance_log", std::move(cov));
  cal.insert("dof", static_cast<int64_t>(c.dof));
  cal.insert("rms_K", c.rms_K);
  cal.insert("n_points", static_cast<int64_t>(c.n_points));
  cal.insert("design_probe", c.design_probe);
  cal.insert("date", c.date);
  toml::array study;
  for (const std::string& s : c.study) study.push_back(s);
  cal.insert("study", std::move(study));
  toml::array hs;
  for (const CalibratedH& g : c.h) {
    toml::table e;
    toml::array names;
    for (const std::string& n : g.stages) names.push_back(n);
    e.insert("stages", std::move(names));
    e.insert("status", status_key(g.status));
    e.insert("h_W_m2K", g.h_W_m2K);
    if (g.status == CalibratedHStatus::fitted) e.insert("ci95_W_m2K", number_pair(g.ci95_W_m2K));
    hs.push_back(std::move(e));
  }
  if (!hs.empty()) cal.insert("h", std::move(hs));
  doc.insert_or_assign("calibration", std::move(cal));

  std::ostringstream o;
  o << "# Calibrated product file written by coldcore fit on " << c.date << ".\n"
    << "# Source of product.properties.conductivity_W_mK, product.ranges.conductivity_W_mK and of every h_W_m2K /\n"
    << "# h_range_W_m2K named in [calibration]: the heat-penetration study listed in calibration.study, fitted to\n"
    << "# the slowest-heating probe (" << c.design_probe << "); the ranges are the fit's 95 % intervals.\n"
    << "# Every other value is the original file's; its sources are in the original, kept at the end.\n"
    << "# An engineering estimate: a qualified process authority reviews the study before it is relied on.\n";
  o << "schema = " << detail::format_value(*doc.get("schema")) << "\n";
  doc.erase("schema");
  emit(o, doc, "");
  o << "\n# ---- the original product file, for the sources of its values ----\n";
  std::size_t pos = 0;
  while (pos < original.size()) {
    const std::size_t nl = original.find('\n', pos);
    const std::string_view line = original.substr(pos, nl == std::string_view::npos ? original.size() - pos : nl - pos);
    o << "# " << line << "\n";
    pos = nl == std::string_view::npos ? original.size() : nl + 1;
  }
  return o.str();
}

}  // namespace coldcore::io
