// coldcore organisms | rules: the data libraries with every value's source.
#include <ostream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/reference_tables.hpp"

namespace coldcore {

namespace {

std::string temp_text(double c, TempUnit u) { return fixed(display_temp(c, u), 1) + " " + std::string(unit_symbol(u)); }
std::string diff_text(double k, TempUnit u) { return fixed(display_temp_difference(k, u), 2) + " " + std::string(unit_symbol(u)); }

void write_cautions_text(std::ostream& out) {
  out << "\nCAUTIONS\n";
  for (const auto& c : cautions()) out << "  * " << c << "\n";
}

}  // namespace

static void write_organism_library_unrendered(const OrganismLibrary& lib, Format f, TempUnit u, std::ostream& out);

void write_organism_library(const OrganismLibrary& lib, Format f, TempUnit u, std::ostream& out) {
  write_rendered(out, u, [&](std::ostream& o) { write_organism_library_unrendered(lib, f, u, o); });
}

static void write_organism_library_unrendered(const OrganismLibrary& lib, Format f, TempUnit u, std::ostream& out) {
  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    write_json_envelope(w, "organisms", u);
    w.key("library").value(lib.origin).key("organisms").begin_array();
    for (const auto& o : lib.organisms) {
      const Kinetics& k = o.kinetics;
      w.begin_object();
      w.key("key").value(k.key).key("name").value(k.name).key("kind").value(o.kind);
      // In the report's unit; "values" below keeps each entry as the library writes it, with its source.
      const std::string us(unit_suffix(u));
      w.key("reference_" + us).value(display_temp(k.reference_C, u));
      w.key("z_" + us).value(display_temp_difference(k.z_C, u));
      if (k.split_C)
        w.key("split_" + us).value(display_temp(*k.split_C, u)).key("z_below_" + us).value(display_temp_difference(*k.z_below_C, u));
      if (k.D_ref_s) w.key("D_ref_s").value(*k.D_ref_s);
      w.key("valid_min_" + us).value(display_temp(k.valid_min_C, u)).key("valid_max_" + us).value(display_temp(k.valid_max_C, u));
      w.key("values").begin_array();
      for (const auto& [key, v] : o.values)
        w.begin_object().key("key").value(key).key("value").value(v.value).key("source").value(v.source)
            .key("status").value(v.status).end_object();
      w.end_array();
      w.end_object();
    }
    w.end_array().key("cautions").value(cautions()).end_object();
    return;
  }
  if (f == Format::csv) {
    for (const auto& c : cautions()) out << "# caution: " << c << "\n";
    out << "key,quantity,value,status,source\n";
    for (const auto& o : lib.organisms)
      for (const auto& [key, v] : o.values)
        out << o.kinetics.key << "," << key << "," << csv_number(v.value) << "," << v.status << ","
            << csv_cell(v.source) << "\n";
    return;
  }
  out << "Organism heat-resistance library (" << lib.origin << ")\n";
  for (const auto& o : lib.organisms) {
    const Kinetics& k = o.kinetics;
    out << "\n" << k.key << ": " << k.name << " (" << o.kind << ")\n";
    out << "  reference " << temp_text(k.reference_C, u) << ", z " << diff_text(k.z_C, u);
    if (k.split_C) out << " at and above " << temp_text(*k.split_C, u) << ", z " << diff_text(*k.z_below_C, u) << " below";
    out << "\n";
    if (k.D_ref_s) out << "  D at reference " << fixed(*k.D_ref_s / 60.0, 4) << " min\n";
    out << "  data valid from " << temp_text(k.valid_min_C, u) << " to " << temp_text(k.valid_max_C, u) << "\n";
    for (const auto& [key, v] : o.values) out << "    " << key << " [" << v.status << "]: " << v.source << "\n";
    if (o.has_unconfirmed()) out << "  ! some values are from memory: verify against the primary source before use\n";
  }
  write_cautions_text(out);
}

static void write_rule_library_unrendered(const RuleLibrary& lib, Format f, TempUnit u, std::ostream& out);

void write_rule_library(const RuleLibrary& lib, Format f, TempUnit u, std::ostream& out) {
  write_rendered(out, u, [&](std::ostream& o) { write_rule_library_unrendered(lib, f, u, o); });
}

static void write_rule_library_unrendered(const RuleLibrary& lib, Format f, TempUnit u, std::ostream& out) {
  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    write_json_envelope(w, "rules", u);
    w.key("library").value(lib.origin).key("rules").begin_array();
    for (const auto& r : lib.rules) {
      w.begin_object().key("key").value(r.key).key("name").value(r.name).key("source").value(r.source)
          .key("status").value(r.status);
      if (r.chill_start_within_s) w.key("chill_start_within_s").value(*r.chill_start_within_s);
      w.key("steps").begin_array();
      // In the report's unit, as the rule writes the limit when it writes that unit.
      const auto as_written = [&](double c, const std::optional<double>& f) {
        return u == TempUnit::F && f ? *f : display_temp(c, u);
      };
      const std::string us(unit_suffix(u));
      for (const auto& s : r.steps) {
        w.begin_object().key("from_" + us).value(as_written(s.from_C, s.from_written_F));
        w.key("to_" + us).value(as_written(s.to_C, s.to_written_F)).key("within_s").value(s.within_s)
            .key("advisory").value(s.advisory).key("source").value(s.source).key("status").value(s.status).end_object();
      }
      w.end_array().end_object();
    }
    w.end_array().key("cautions").value(cautions()).end_object();
    return;
  }
  if (f == Format::csv) {
    for (const auto& c : cautions()) out << "# caution: " << c << "\n";
    out << "key,step,from_C,to_C,within_s,advisory,status,source\n";
    for (const auto& r : lib.rules) {
      int n = 0;
      for (const auto& s : r.steps)
        out << r.key << "," << ++n << "," << JsonWriter::number(s.from_C) << "," << JsonWriter::number(s.to_C) << ","
            << JsonWriter::number(s.within_s) << "," << (s.advisory ? "yes" : "no") << "," << s.status << ","
            << csv_cell(s.source) << "\n";
    }
    return;
  }
  out << "Cooling-rule library (" << lib.origin << ")\n";
  for (const auto& r : lib.rules) {
    out << "\n" << r.key << ": " << r.name << " [" << r.status << "]\n  source: " << r.source << "\n";
    for (const auto& s : r.steps)
      out << "  " << render_temperatures(s.from_text, u) << " -> " << render_temperatures(s.to_text, u) << " within "
          << duration_text(s.within_s)
          << (s.advisory ? " (advisory)" : "") << "\n";
    if (r.chill_start_within_s) out << "  chilling must begin within " << duration_text(*r.chill_start_within_s) << " of the cook\n";
    if (!r.note.empty()) out << "  note: " << r.note << "\n";
  }
  write_cautions_text(out);
}

}  // namespace coldcore
