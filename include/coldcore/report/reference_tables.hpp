#pragma once
/// Reference tables that are not process reports: the series modes, properties from a
/// composition, and the data libraries (organisms, cooling rules, media) with their sources.
/// Each writes text, json or csv, with the cautions, from numbers the lower layers computed.
#include <iosfwd>
#include <string>
#include <vector>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/model/media_library.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"
#include "coldcore/properties/composition.hpp"
#include "coldcore/report/format.hpp"

namespace coldcore {

struct ModesTable {
  Geometry geometry = Geometry::sphere;
  double biot = 1;             ///< may be kInfiniteBiot
  std::vector<Mode> modes;     ///< the modes shown
  double one_term_fourier = 0; ///< conduction/modes.hpp, from at least two modes
};
void write_modes_table(const ModesTable& t, Format f, TempUnit u, std::ostream& out);

struct PropertiesTable {
  Composition composition;
  std::vector<PropertyRow> rows;
};
void write_properties_table(const PropertiesTable& t, Format f, TempUnit u, std::ostream& out);

void write_organism_library(const OrganismLibrary& lib, Format f, TempUnit u, std::ostream& out);
void write_rule_library(const RuleLibrary& lib, Format f, TempUnit u, std::ostream& out);
void write_media_library(const MediaLibrary& lib, Format f, TempUnit u, std::ostream& out);

}  // namespace coldcore
