// [[target]] tables: what the process must achieve. Organism and rule keys are stored as given;
// lethality/ resolves them against the data libraries.
#include <array>
#include <cmath>

#include "coldcore/error.hpp"
#include "coldcore/model/limits.hpp"
#include "io/detail/product_parts.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io::detail {

namespace {


struct KindName {
  std::string_view name;
  TargetKind kind;
};
constexpr std::array<KindName, 5> kKinds = {{{"log-reduction", TargetKind::log_reduction},
                                             {"F-value", TargetKind::f_value},
                                             {"cooling-rule", TargetKind::cooling_rule},
                                             {"centre-min-temperature", TargetKind::centre_min_temperature},
                                             {"cooking-table", TargetKind::cooking_table}}};

std::vector<KeySpec> specs_for(TargetKind k) {
  std::vector<KeySpec> s = {plain("kind"), plain("name")};
  switch (k) {
    case TargetKind::log_reduction:
      s.insert(s.end(), {plain("organism"), plain("log_reduction"), quantity("reference", Quantity::temperature),
                         quantity("z", Quantity::temperature_difference), quantity("D", Quantity::time),
                         plain("stages")});
      break;
    case TargetKind::f_value:
      s.insert(s.end(), {quantity("reference", Quantity::temperature),
                         quantity("z", Quantity::temperature_difference), quantity("F", Quantity::time),
                         plain("stages")});
      break;
    case TargetKind::cooling_rule: s.insert(s.end(), {plain("rule"), plain("at")}); break;
    case TargetKind::cooking_table: s.insert(s.end(), {plain("table"), plain("at")}); break;
    case TargetKind::centre_min_temperature:
      s.insert(s.end(), {quantity("min", Quantity::temperature), quantity("hold", Quantity::time), plain("at")});
      break;
  }
  return s;
}

double reference_temperature(const Fields& f, const std::string& why) {
  Found fr;
  const auto v = f.quantity_si("reference", &fr);
  if (!v) f.missing("reference_*", why + " (reference_C or reference_F)");
  if (*v < limits::absolute_zero_C) f.fail(fr.key, "below absolute zero (-273.15 C, -459.67 F)");
  f.require_range(fr.key, *v, limits::temperature_C, Quantity::temperature, fr.unit);
  return *v;
}

double z_value(const Fields& f, const std::string& why) {
  Found fz;
  const auto v = f.quantity_si("z", &fz);
  if (!v) f.missing("z_*", why + " (z_C or z_F, > 0; z_F = 1.8 x z_C)");
  if (!(*v > 0)) f.fail(fz.key, "must be > 0");
  f.require_range(fz.key, *v, limits::z_C, Quantity::temperature_difference, fz.unit);
  return *v;
}

/// A positive time quantity, required.
double positive_time(const Fields& f, std::string_view base, const std::string& why) {
  Found ft;
  const auto v = f.quantity_si(base, &ft);
  if (!v) f.missing(std::string(base) + "_*", why + " (" + spellings(base, Quantity::time) + ", > 0)");
  if (!(*v > 0)) f.fail(ft.key, "must be > 0");
  f.require_range(ft.key, *v, limits::duration_s, Quantity::time, ft.unit);
  return *v;
}

std::vector<std::string> parse_stage_list(const Fields& f, const std::vector<Stage>& stages) {
  std::vector<std::string> out;
  const toml::node* n = f.node("stages");
  if (n == nullptr) return out;
  const toml::array* a = n->as_array();
  const std::string need = "must be an array of stage names, e.g. [\"" + stages.front().name + "\"]";
  if (a == nullptr) f.fail("stages", need);
  if (a->empty()) f.fail("stages", "must name at least one stage (leave the key out to count all stages)");
  std::vector<std::string> names;
  for (const auto& s : stages) names.push_back(s.name);
  for (std::size_t i = 0; i < a->size(); ++i) {
    const toml::node& el = *a->get(i);
    const std::string where = f.origin() + ": " + f.key_path("stages[" + std::to_string(i + 1) + "]") + " = " +
                              format_value(el) + ": ";
    const auto* s = el.as_string();
    if (s == nullptr) throw InputError(where + "must be a stage name in double quotes");
    bool found = false;
    for (const auto& nm : names) found = found || nm == s->get();
    if (!found) {
      std::string msg = where + "no such stage";
      if (auto near = did_you_mean(s->get(), names)) {
        msg += "; did you mean " + quote(*near) + "?";
      } else {
        msg += "; the stages are ";
        for (std::size_t j = 0; j < names.size(); ++j) msg += (j ? ", " : "") + quote(names[j]);
      }
      throw InputError(msg);
    }
    for (const auto& prev : out)
      if (prev == s->get()) throw InputError(where + "listed twice");
    out.push_back(s->get());
  }
  return out;
}

std::string parse_at(const Fields& f) {
  const auto at = f.string("at");
  if (!at) return "centre";
  if (*at != "centre" && *at != "mean") f.fail("at", "must be \"centre\" or \"mean\"");
  return *at;
}

Target parse_target(const Fields& f, TargetKind kind, std::size_t index, const std::vector<Stage>& stages) {
  Target t;
  t.kind = kind;
  const auto name = f.string("name");
  if (name && name->empty()) f.fail("name", "must not be empty");
  switch (kind) {
    case TargetKind::log_reduction: {
      const auto organism = f.string("organism");
      const bool own = f.find("reference") || f.find("z") || f.find("D");
      if (organism && own) {
        const auto k = f.find("reference") ? f.find("reference") : f.find("z") ? f.find("z") : f.find("D");
        f.fail(k->key, "given together with organism; give organism = \"key\" or own kinetics "
                       "(reference_*, z_*, D_*), not both");
      }
      if (!organism && !own)
        f.missing("organism", "give organism = \"key\" (a library organism) or own kinetics reference_C|F, z_C|F, "
                              "D_s|min|h");
      if (organism) {
        if (organism->empty()) f.fail("organism", "must not be empty");
        t.organism = *organism;
      } else {
        const std::string why = "own kinetics need reference_*, z_* and D_* (D at the reference temperature)";
        OwnKinetics k;
        k.reference_C = reference_temperature(f, why);
        k.z_C = z_value(f, why);
        k.D_ref_s = positive_time(f, "D", why);
        t.own = k;
      }
      const toml::node* lr = f.node("log_reduction");
      if (lr == nullptr) f.missing("log_reduction", "the required decimal reductions, > 0 (e.g. 6)");
      t.log_reduction = f.number_of("log_reduction", *lr, false, "decimal reductions");
      if (!(t.log_reduction > 0)) f.fail("log_reduction", "must be > 0");
      t.stages = parse_stage_list(f, stages);
      t.name = name ? *name : organism ? *organism : "target" + std::to_string(index);
      break;
    }
    case TargetKind::f_value: {
      if (!name) f.missing("name", "an F-value target needs a name (it names the csv column F_<name>_min)");
      t.name = *name;
      OwnKinetics k;
      k.reference_C = reference_temperature(f, "an F-value needs its reference temperature");
      k.z_C = z_value(f, "an F-value needs its z-value");
      t.own = k;
      t.F_required_s = positive_time(f, "F", "the required F-value, a time at the reference temperature");
      t.stages = parse_stage_list(f, stages);
      break;
    }
    case TargetKind::cooling_rule: {
      const auto rule = f.string("rule");
      if (!rule) f.missing("rule", "a rule key of the cooling-rule library (coldcore rules lists them)");
      if (rule->empty()) f.fail("rule", "must not be empty");
      t.rule = *rule;
      t.at = parse_at(f);
      t.name = name ? *name : *rule;
      break;
    }
    case TargetKind::cooking_table: {
      const auto table = f.string("table");
      if (!table) f.missing("table", "a table key of the cooking-table library (products/cooking-tables.toml)");
      if (table->empty()) f.fail("table", "must not be empty");
      t.table = *table;
      t.at = parse_at(f);
      t.name = name ? *name : *table;
      break;
    }
    case TargetKind::centre_min_temperature: {
      Found fm, fh;
      const auto min = f.quantity_si("min", &fm);
      if (!min) f.missing("min_*", "the temperature to reach (min_C or min_F)");
      if (*min < limits::absolute_zero_C) f.fail(fm.key, "below absolute zero (-273.15 C, -459.67 F)");
      f.require_range(fm.key, *min, limits::temperature_C, Quantity::temperature, fm.unit);
      const auto hold = f.quantity_si("hold", &fh);
      if (!hold) f.missing("hold_*", "how long to stay at or above it (hold_s, hold_min or hold_h, >= 0)");
      if (!(*hold >= 0)) f.fail(fh.key, "must be >= 0");
      f.require_range(fh.key, *hold, limits::duration_s, Quantity::time, fh.unit);
      t.min_temp_C = *min;
      t.hold_s = *hold;
      t.at = parse_at(f);
      t.name = name ? *name : "centre-min-temperature";
      break;
    }
  }
  return t;
}

}  // namespace

void parse_targets(const Fields& root, ProductFile& out) {
  const toml::node* node = root.node("target");
  if (node == nullptr) return;
  const toml::array* arr = node->as_array();
  if (arr == nullptr || !arr->is_array_of_tables())
    root.fail("target", "must be [[target]] tables (double brackets)");
  if (arr->size() > limits::max_targets)
    throw InputError(root.origin() + ": target: " + std::to_string(arr->size()) + " [[target]] tables: at most " +
                     std::to_string(limits::max_targets));
  for (std::size_t i = 0; i < arr->size(); ++i) {
    const std::string path = "target[" + std::to_string(i + 1) + "]";
    const toml::table& tbl = *arr->get(i)->as_table();
    const toml::node* kind_node = tbl.get("kind");
    std::vector<std::string> kind_names;
    for (const auto& k : kKinds) kind_names.emplace_back(k.name);
    const std::string accepted = "accepted: log-reduction, F-value, cooling-rule, centre-min-temperature";
    const std::string where = root.origin() + ": " + path + ".kind";
    if (kind_node == nullptr) throw InputError(where + ": missing: " + accepted);
    const auto* ks = kind_node->as_string();
    if (ks == nullptr) throw InputError(where + " = " + format_value(*kind_node) + ": must be a string; " + accepted);
    std::optional<TargetKind> kind;
    for (const auto& k : kKinds)
      if (k.name == ks->get()) kind = k.kind;
    if (!kind) {
      std::string msg = where + " = " + quote(ks->get()) + ": unknown kind; ";
      if (auto near = did_you_mean(ks->get(), kind_names)) msg += "did you mean " + quote(*near) + "? ";
      throw InputError(msg + accepted);
    }
    Fields f(tbl, root.origin(), path, specs_for(*kind));
    Target t = parse_target(f, *kind, i + 1, out.stages);
    // The name becomes a csv column (F_<name>_min) and a report label.
    for (char c : t.name)
      if (c == ',' || c == '"' || static_cast<unsigned char>(c) < 0x20)
        throw InputError(root.origin() + ": " + path + ".name = " + quote(t.name) +
                         ": must not contain commas, double quotes or control characters (it names a csv column)");
    for (std::size_t j = 0; j < out.targets.size(); ++j)
      if (out.targets[j].name == t.name)
        throw InputError(root.origin() + ": " + path + ".name = " + quote(t.name) + ": same as target[" +
                         std::to_string(j + 1) + "]; target names must be unique (they name report columns)");
    out.targets.push_back(std::move(t));
  }
}

}  // namespace coldcore::io::detail
