// Verbs of the design whose issues have not landed would be listed here: they say so, and produce
// no output. Every verb of DESIGN.md is now implemented, so the table is empty.
#include "cli/verbs.hpp"

namespace coldcore::cli {

void add_pending_verbs(CLI::App&, VerbContext&) {}

}  // namespace coldcore::cli
