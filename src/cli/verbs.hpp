#pragma once
// The verb table: each verb file adds its subcommand to the app and sets `run`, which writes the
// report to `out`, notes to `err` and returns the exit code. main() only parses, dispatches and turns coldcore::Error into one stderr line.
#include <functional>
#include <iosfwd>
#include <string>

#include <CLI/CLI.hpp>

namespace coldcore::cli {

/// Exit codes scripts can rely on.
enum ExitCode : int {
  kAllMet = 0,          ///< success; every target met, or there are none
  kNotDemonstrated = 1, ///< at least one target not demonstrated (or an inverse question has no answer)
  kBadInput = 2,        ///< bad input or usage
};

/// Every verb runs as `run_<verb>(args, out, err)`: the report goes to `out` (or to --out), the
/// one-line notes for the person at the terminal to `err`; the return value is the exit code.
using VerbRun = std::function<int(std::ostream& out, std::ostream& err)>;

struct VerbContext {
  VerbRun run;  ///< set by the chosen verb's callback
};

void add_modes_verb(CLI::App& app, VerbContext& ctx);
void add_props_verb(CLI::App& app, VerbContext& ctx);
void add_library_verbs(CLI::App& app, VerbContext& ctx);
void add_probe_verb(CLI::App& app, VerbContext& ctx);
void add_run_verb(CLI::App& app, VerbContext& ctx);
void add_solve_verb(CLI::App& app, VerbContext& ctx);
void add_deviation_verb(CLI::App& app, VerbContext& ctx);
void add_fit_verb(CLI::App& app, VerbContext& ctx);
void add_media_verb(CLI::App& app, VerbContext& ctx);
void add_pending_verbs(CLI::App& app, VerbContext& ctx);
/// `coldcore help [VERB]`: the app's help, or the verb's.
void add_help_verb(CLI::App& app, VerbContext& ctx);

/// InputError for the first `--name` in argv[first, argc) that `verb` has no option for, naming
/// the nearest one ("did you mean") and `coldcore help VERB`. Stops at `--`.
void check_option_names(const CLI::App& verb, int argc, char** argv, int first);

/// Every verb above, in the order `coldcore --help` lists them: the one verb table (main and the
/// command-line fuzz harness both build their app with it).
void add_all_verbs(CLI::App& app, VerbContext& ctx);

}  // namespace coldcore::cli
