#include "cli/verbs.hpp"

namespace coldcore::cli {

void add_all_verbs(CLI::App& app, VerbContext& ctx) {
  add_run_verb(app, ctx);
  add_modes_verb(app, ctx);
  add_props_verb(app, ctx);
  add_probe_verb(app, ctx);
  add_library_verbs(app, ctx);
  add_solve_verb(app, ctx);
  add_deviation_verb(app, ctx);
  add_fit_verb(app, ctx);
  add_media_verb(app, ctx);
  add_pending_verbs(app, ctx);
  add_help_verb(app, ctx);
}

}  // namespace coldcore::cli
