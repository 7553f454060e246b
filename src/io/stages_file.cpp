// [[stage]] tables: medium schedule (constant, points, or logged), h, end condition.
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/model/limits.hpp"
#include "io/detail/product_parts.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io::detail {

namespace {


std::vector<KeySpec> stage_specs() {
  return {plain("name"),
          {"medium", KeyForm::medium, Quantity::temperature},
          plain("medium_log"),
          quantity("medium_log_max_gap", Quantity::time),
          quantity("h", Quantity::heat_transfer_coefficient),
          plain("medium_type"),
          plain("h_range_W_m2K"),
          quantity("duration", Quantity::time),
          quantity("until_centre", Quantity::temperature),
          quantity("until_mean", Quantity::temperature),
          quantity("max_duration", Quantity::time)};
}

MediumProfile parse_medium_value(const Fields& f, const Found& m) {
  MediumProfile prof;
  const toml::node& n = *m.node;
  if (n.is_number()) {
    if (m.key != "medium_" + m.unit)
      f.fail(m.key, "a constant medium temperature has no time unit; write medium_" + m.unit + " = " +
                        format_value(n));
    const double temp_C = *to_si(Quantity::temperature, f.number_of(m.key, n, false, "temperature in " + m.unit), m.unit);
    if (temp_C < limits::absolute_zero_C) f.fail(m.key, "below absolute zero (-273.15 C, -459.67 F)");
    f.require_range(m.key, temp_C, limits::temperature_C, Quantity::temperature, m.unit);
    prof.points.push_back({0.0, temp_C});
    prof.description = "constant";
    return prof;
  }
  const toml::array* a = n.as_array();
  if (a == nullptr)
    f.fail(m.key, "must be a temperature in " + m.unit + " or points [[time_" + m.time_unit + ", temp_" + m.unit +
                      "], ...]");
  if (a->empty()) f.fail(m.key, "must have at least one point [time_" + m.time_unit + ", temp_" + m.unit + "]");
  const std::string pair_need = "must be a pair of numbers [time_" + m.time_unit + ", temp_" + m.unit + "]";
  double prev_raw_t = 0;
  for (std::size_t i = 0; i < a->size(); ++i) {
    const std::string el_key = m.key + "[" + std::to_string(i + 1) + "]";
    const toml::node& el = *a->get(i);
    const auto el_fail = [&](const std::string& req) {
      throw InputError(f.origin() + ": " + f.key_path(el_key) + " = " + format_value(el) + ": " + req);
    };
    const toml::array* pt = el.as_array();
    if (pt == nullptr || pt->size() != 2 || !pt->get(0)->is_number() || !pt->get(1)->is_number()) el_fail(pair_need);
    const double t_raw = pt->get(0)->value<double>().value_or(0);
    const double temp_raw = pt->get(1)->value<double>().value_or(0);
    if (!std::isfinite(t_raw) || !std::isfinite(temp_raw)) el_fail("must be finite numbers");
    if (i == 0 && t_raw != 0) el_fail("the first point must be at time 0 (the stage's start)");
    if (i > 0 && !(t_raw > prev_raw_t))
      el_fail("time must be after the previous point's " + format_number(prev_raw_t) + " " + m.time_unit +
              " (times must increase)");
    const double temp_C = *to_si(Quantity::temperature, temp_raw, m.unit);
    if (temp_C < limits::absolute_zero_C) el_fail("below absolute zero (-273.15 C, -459.67 F)");
    if (!limits::temperature_C.contains(temp_C))
      el_fail("temperature must be " + range_text(limits::temperature_C, Quantity::temperature, m.unit));
    const double t_s = *to_si(Quantity::time, t_raw, m.time_unit);
    if (!limits::duration_s.contains(t_s))
      el_fail("time must be " + range_text(limits::duration_s, Quantity::time, m.time_unit));
    prof.points.push_back({t_s, temp_C});
    prev_raw_t = t_raw;
  }
  prof.description = "points";
  return prof;
}

MediumProfile parse_medium_log(const Fields& f, const std::filesystem::path& base_dir, const LogReader& read_log,
                               ProductFile& out, double& log_length_s, std::vector<std::array<double, 2>>& gaps_s) {
  const auto rel = f.string("medium_log");
  if (rel->empty()) f.fail("medium_log", "must name a CSV file, relative to this file");
  if (!read_log) f.fail("medium_log", "cannot read logs here (no file reader given)");
  const std::filesystem::path path = base_dir / *rel;
  std::optional<std::string> text;
  try {
    text = read_log(path);
  } catch (const InputError& e) {  // the reader says why (missing, a directory, a FIFO, too large)
    f.fail("medium_log", e.what());
  }
  if (!text) f.fail("medium_log", "cannot read file " + quote(path.generic_string()));
  LogOptions opts;
  opts.choose_column_hint = "a medium_log is read with one temperature column; keep only the medium's";
  Found gap;
  if (auto g = f.quantity_si("medium_log_max_gap", &gap)) {
    if (!(*g > 0)) f.fail(gap.key, "must be > 0");
    f.require_range(gap.key, *g, limits::duration_s, Quantity::time, gap.unit);
    opts.max_gap_s = *g;
  }
  TimeSeries log = parse_log_csv(*text, path.generic_string(), opts);
  for (auto& w : log.warnings) out.warnings.push_back(std::move(w));
  log_length_s = log.time_s.back();
  // On the medium profile's clock (the stage's, medium_profile below).
  for (std::size_t i = 1; i < log.time_s.size(); ++i)
    if (log.time_s[i] - log.time_s[i - 1] > opts.max_gap_s) gaps_s.push_back({log.time_s[i - 1], log.time_s[i]});
  return medium_profile(log, path.generic_string(), *text);
}

/// medium_type (h from the media library later, apply_media) and h_range_W_m2K beside h_W_m2K.
/// Returns true when h comes from medium_type (then h_W_m2K is absent and stays 0 here).
bool parse_h_extras(const Fields& f, const Stage& s, StageH& out) {
  if (auto mt = f.string("medium_type")) {
    if (auto fh = f.find("h")) f.fail("medium_type", "given together with " + fh->key + "; give one");
    if (f.node("h_range_W_m2K") != nullptr) f.fail("h_range_W_m2K", "not used with medium_type (its range comes from media.toml)");
    if (mt->empty()) f.fail("medium_type", "must name a medium of media.toml");
    out.medium_type = *mt;
    return true;
  }
  if (const toml::node* n = f.node("h_range_W_m2K")) {
    const toml::array* a = n->as_array();
    const std::string need = "must be [low, high] in W/(m2 K), 0 < low <= high";
    if (a == nullptr || a->size() != 2 || !a->get(0)->is_number() || !a->get(1)->is_number()) f.fail("h_range_W_m2K", need);
    const double lo = a->get(0)->value<double>().value_or(0), hi = a->get(1)->value<double>().value_or(0);
    if (!(lo > 0) || !(hi >= lo) || !std::isfinite(hi)) f.fail("h_range_W_m2K", need);
    if (!limits::h_W_m2K.contains(lo) || !limits::h_W_m2K.contains(hi))
      f.fail("h_range_W_m2K", "both ends must be " + range_text(limits::h_W_m2K, std::nullopt, "W/(m2 K)"));
    (void)s;
    out.h_range_W_m2K = {lo, hi};
  }
  return false;
}

void parse_h(const Fields& f, Stage& s) {
  const auto fh = f.find("h");
  if (!fh) f.missing("h_W_m2K", "surface heat-transfer coefficient, > 0 W/(m2 K) (or h_Btu_hft2F), or inf");
  const std::string& key = fh->key;
  const std::string unit(unit_text(fh->unit));
  const toml::node* n = fh->node;
  const std::string need = "must be > 0 " + unit + ", or inf for a surface held at the medium temperature";
  if (auto str = n->as_string()) {
    if (str->get() != "inf") f.fail(key, need);
    s.h_infinite = true;
    s.h_W_m2K = std::numeric_limits<double>::infinity();
    return;
  }
  if (!n->is_number()) f.fail(key, "must be a number (" + unit + ") or inf");
  const double written = n->value<double>().value_or(0);
  // h = 0 is an insulated surface: the product never exchanges heat, almost always a slip.
  if (!(written > 0)) f.fail(key, need);
  const double h = std::isinf(written) ? written : *to_si(Quantity::heat_transfer_coefficient, written, fh->unit);
  if (!std::isinf(h)) f.require_range(key, h, limits::h_W_m2K, Quantity::heat_transfer_coefficient, fh->unit, "or inf");
  s.h_W_m2K = h;
  s.h_infinite = std::isinf(h);
}

void parse_end(const Fields& f, Stage& s, std::optional<double> log_length_s, ProductFile& out) {
  Found fd, fc, fm, fx;
  const auto duration = f.quantity_si("duration", &fd);
  const auto centre = f.quantity_si("until_centre", &fc);
  const auto mean = f.quantity_si("until_mean", &fm);
  const auto cap = f.quantity_si("max_duration", &fx);

  const Found* first = nullptr;
  for (const auto& [v, fnd] : {std::pair{duration, &fd}, std::pair{centre, &fc}, std::pair{mean, &fm}}) {
    if (!v) continue;
    if (first != nullptr) f.fail(fnd->key, "given together with " + first->key + "; give one end condition");
    first = fnd;
  }
  if (duration) {
    if (!(*duration > 0)) f.fail(fd.key, "must be > 0");
    f.require_range(fd.key, *duration, limits::duration_s, Quantity::time, fd.unit);
    if (cap) f.fail(fx.key, "only used with until_centre_* or until_mean_* (a duration needs no cap)");
    s.end.kind = StageEndKind::duration;
    s.end.duration_s = *duration;
    if (log_length_s && *duration > *log_length_s)
      out.warnings.push_back(f.origin() + ": " + f.key_path(fd.key) + " = " + format_value(*fd.node) +
                             ": longer than the medium log (" + format_number(*log_length_s) +
                             " s); its last temperature is held to the end");
    return;
  }
  if (centre || mean) {
    const Found& fu = centre ? fc : fm;
    const double target = centre ? *centre : *mean;
    if (target < limits::absolute_zero_C) f.fail(fu.key, "below absolute zero (-273.15 C, -459.67 F)");
    f.require_range(fu.key, target, limits::temperature_C, Quantity::temperature, fu.unit);
    if (!cap)
      f.missing("max_duration_*", fu.key + " = " + format_value(*fu.node) +
                                      " needs a cap (max_duration_s, max_duration_min or max_duration_h, > 0)");
    if (!(*cap > 0)) f.fail(fx.key, "must be > 0");
    f.require_range(fx.key, *cap, limits::duration_s, Quantity::time, fx.unit);
    s.end.kind = centre ? StageEndKind::until_centre : StageEndKind::until_mean;
    s.end.target_C = target;
    s.end.max_duration_s = *cap;
    return;
  }
  if (cap) f.fail(fx.key, "only used with until_centre_* or until_mean_*");
  if (log_length_s) {
    if (!(*log_length_s > 0))
      f.fail("medium_log", "the log covers 0 s (one row); give duration_s, duration_min or duration_h");
    s.end.kind = StageEndKind::duration;
    s.end.duration_s = *log_length_s;
    return;
  }
  f.missing("duration_*", "give duration_s|min|h, or until_centre_C|F or until_mean_C|F with max_duration_s|min|h");
}

}  // namespace

void parse_stages(const Fields& root, const std::filesystem::path& base_dir, const LogReader& read_log,
                  ProductFile& out) {
  const toml::node* node = root.node("stage");
  if (node == nullptr) root.missing("stage", "at least one [[stage]] table (medium, h_W_m2K, end condition)");
  const toml::array* arr = node->as_array();
  if (arr == nullptr || !arr->is_array_of_tables() || arr->empty())
    root.fail("stage", "must be one or more [[stage]] tables (double brackets)");
  if (arr->size() > limits::max_stages)
    throw InputError(root.origin() + ": stage: " + std::to_string(arr->size()) + " [[stage]] tables: at most " +
                     std::to_string(limits::max_stages));
  for (std::size_t i = 0; i < arr->size(); ++i) {
    const std::string path = "stage[" + std::to_string(i + 1) + "]";
    Fields f(*arr->get(i)->as_table(), root.origin(), path, stage_specs());
    Stage s;
    const auto name = f.string("name");
    s.name = name ? *name : "stage " + std::to_string(i + 1);
    if (s.name.empty()) f.fail("name", "must not be empty");
    for (std::size_t j = 0; j < out.stages.size(); ++j)
      if (out.stages[j].name == s.name)
        f.fail("name", "same as stage[" + std::to_string(j + 1) + "]; stage names must be unique");

    const auto medium = f.find("medium");
    const bool has_log = f.node("medium_log") != nullptr;
    if (medium && has_log) f.fail("medium_log", "given together with " + medium->key + "; give one");
    if (!medium && !has_log)
      f.missing("medium_*", "give medium_C|F (a temperature, or points [[t_s, T], ...]) or medium_log = \"file.csv\"");
    if (!has_log) {
      if (auto g = f.find("medium_log_max_gap")) f.fail(g->key, "only used with medium_log");
    }
    std::optional<double> log_length_s;
    if (medium) {
      s.medium = parse_medium_value(f, *medium);
    } else {
      double len = 0;
      s.medium = parse_medium_log(f, base_dir, read_log, out, len, s.medium_gaps_s);
      log_length_s = len;
    }
    StageH sh;
    if (!parse_h_extras(f, s, sh)) {
      parse_h(f, s);
      if (sh.h_range_W_m2K && !s.h_infinite &&
          (s.h_W_m2K < (*sh.h_range_W_m2K)[0] || s.h_W_m2K > (*sh.h_range_W_m2K)[1]))
        f.fail("h_range_W_m2K", "must contain h_W_m2K = " + format_number(s.h_W_m2K));
    }
    parse_end(f, s, log_length_s, out);
    out.stage_h.push_back(std::move(sh));
    out.stages.push_back(std::move(s));
  }
}

}  // namespace coldcore::io::detail
