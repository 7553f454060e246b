// coldcore modes: the eigenvalues and coefficients table.
#include <cmath>
#include <cstdio>
#include <ostream>
#include <sstream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/reference_tables.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore {

namespace {
std::string biot_text(double biot) { return std::isinf(biot) ? "inf" : JsonWriter::number(biot); }
}  // namespace

static void write_modes_table_unrendered(const ModesTable& t, Format f, TempUnit u, std::ostream& out);

void write_modes_table(const ModesTable& t, Format f, TempUnit u, std::ostream& out) {
  write_rendered(out, u, [&](std::ostream& o) { write_modes_table_unrendered(t, f, u, o); });
}

static void write_modes_table_unrendered(const ModesTable& t, Format f, TempUnit u, std::ostream& out) {
  std::ostringstream note;
  note << "At the centre the second term is below 1 % of the first once Fo > "
       << fixed(t.one_term_fourier, 3) << "; the handbook rule is that one term serves for Fo > 0.2 (within about 2 %).";

  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    write_json_envelope(w, "modes", u);
    w.key("shape").value(to_string(t.geometry));
    w.key("biot_infinite").value(std::isinf(t.biot));
    if (std::isinf(t.biot)) w.key("biot").null(); else w.key("biot").value(t.biot);
    w.key("modes").begin_array();
    for (const auto& m : t.modes) {
      w.begin_object();
      w.key("n").value(m.n).key("zeta").value(m.zeta).key("coefficient").value(m.coefficient);
      w.key("mean_coefficient").value(m.mean_coefficient);
      w.end_object();
    }
    w.end_array();
    w.key("one_term_fourier").value(t.one_term_fourier);
    w.key("note").value(note.str());
    w.key("cautions").value(cautions());
    w.end_object();
  } else if (f == Format::csv) {
    for (const auto& c : cautions()) out << "# caution: " << c << "\n";
    out << "# shape: " << to_string(t.geometry) << "; Bi: " << biot_text(t.biot) << "\n";  // what the rows are of
    out << "# " << note.str() << "\n";
    out << "n,zeta,coefficient,mean_coefficient\n";
    for (const auto& m : t.modes)
      out << m.n << "," << csv_number(m.zeta) << "," << csv_number(m.coefficient) << ","
          << csv_number(m.mean_coefficient) << "\n";
  } else {
    out << "Eigenvalues of the " << to_string(t.geometry) << " at Bi = " << biot_text(t.biot) << "\n";
    out << "theta(x, Fo) = sum of Cn Xn(x) exp(-zeta_n^2 Fo); mean theta uses Mn in place of Cn Xn.\n\n";
    char buf[160];
    std::snprintf(buf, sizeof buf, "  %5s  %22s  %22s  %22s\n", "n", "zeta_n", "C_n", "M_n (mean)");
    out << buf;
    for (const auto& m : t.modes) {
      std::snprintf(buf, sizeof buf, "  %5d  %22.15g  %22.15g  %22.15g\n", m.n, m.zeta, m.coefficient,
                    m.mean_coefficient);
      out << buf;
    }
    out << "\n" << note.str() << "\n\nCAUTIONS\n";
    for (const auto& c : cautions()) out << "  * " << c << "\n";
  }
}

}  // namespace coldcore
