// coldcore modes: eigenvalues and coefficients (placeholder until the conduction core lands).
#include <iostream>

#include "cli/verbs.hpp"

namespace coldcore::cli {

void add_modes_verb(CLI::App& app, VerbContext& ctx) {
  auto* sub = app.add_subcommand("modes", "eigenvalues and coefficients of the series (teaching) (not available yet)");
  sub->allow_extras();
  sub->callback([&ctx] {
    ctx.run = [] {
      std::cerr << "coldcore: 'modes' is not available yet in this version\n";
      return static_cast<int>(kBadInput);
    };
  });
}

}  // namespace coldcore::cli
