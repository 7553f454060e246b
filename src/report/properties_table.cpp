// coldcore props: thermal properties versus temperature from a composition.
#include <cstdio>
#include <ostream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/reference_tables.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore {

static void write_properties_table_unrendered(const PropertiesTable& t, Format f, TempUnit u, std::ostream& out);

void write_properties_table(const PropertiesTable& t, Format f, TempUnit u, std::ostream& out) {
  write_rendered(out, u, [&](std::ostream& o) { write_properties_table_unrendered(t, f, u, o); });
}

static void write_properties_table_unrendered(const PropertiesTable& t, Format f, TempUnit u, std::ostream& out) {
  const Composition& c = t.composition;
  const std::string source =
      "Choi & Okos (1986) component polynomials with the ASHRAE mixing rules (ASHRAE Handbook—Refrigeration, "
      "Thermal Properties of Foods); unfrozen food only; accuracy that of the fits (a few per cent)";
  const std::string us(unit_suffix(u));
  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    write_json_envelope(w, "props", u);
    w.key("composition").begin_object();
    w.key("water").value(c.water).key("protein").value(c.protein).key("fat").value(c.fat);
    w.key("carbohydrate").value(c.carbohydrate).key("fiber").value(c.fiber).key("ash").value(c.ash);
    w.end_object();
    w.key("source").value(source);
    w.key("rows").begin_array();
    for (const auto& r : t.rows) {
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
    for (const auto& r : t.rows)
      out << csv_number(display_temp(r.temp_C, u)) << "," << csv_number(r.conductivity_W_mK) << ","
          << csv_number(r.density_kg_m3) << "," << csv_number(r.specific_heat_J_kgK) << ","
          << csv_number(r.diffusivity_m2_s) << "\n";
  } else {
    out << "Thermal properties from composition\n  source: " << source << "\n\n";
    char buf[160];
    std::snprintf(buf, sizeof buf, "  %8s  %10s  %10s  %12s  %14s\n", ("temp_" + us).c_str(),
                  "k W/mK", "rho kg/m3", "cp J/kgK", "alpha e-7 m2/s");
    out << buf;
    for (const auto& r : t.rows) {
      std::snprintf(buf, sizeof buf, "  %8.2f  %10.4f  %10.1f  %12.1f  %14.4f\n", display_temp(r.temp_C, u),
                    r.conductivity_W_mK, r.density_kg_m3, r.specific_heat_J_kgK, r.diffusivity_m2_s * 1e7);
      out << buf;
    }
    out << "\nCAUTIONS\n";
    for (const auto& cau : cautions()) out << "  * " << cau << "\n";
  }
}

}  // namespace coldcore
