// libFuzzer harness: the command line. The input is the argument list, one argument per line
// (argv[0] is supplied). The app is assembled as in src/cli/main.cpp and only parsed: the chosen
// verb is not run, so no file is written.
#include <algorithm>
#include <string>
#include <vector>

#include "cli/verbs.hpp"
#include "fuzz/fuzz_support.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace coldcore::cli;
  std::string_view text = coldcore::fuzz::as_text(data, size);
  if (!text.empty() && text.back() == '\n') text.remove_suffix(1);  // a file's final newline ends the last argument
  std::vector<std::string> args{"coldcore"};
  for (std::size_t start = 0; start <= text.size() && args.size() < 64;) {
    const std::size_t end = std::min(text.find('\n', start), text.size());
    args.emplace_back(text.substr(start, end - start));
    start = end + 1;
  }
  std::vector<char*> argv;
  for (std::string& a : args) argv.push_back(a.data());
  argv.push_back(nullptr);

  CLI::App app{"coldcore (fuzz)"};
  app.set_version_flag("--version", std::string("coldcore fuzz"));
  app.require_subcommand(1);
  VerbContext ctx;
  add_all_verbs(app, ctx);
  coldcore::fuzz::expect_parsed_or_refused([&] {
    try {
      app.parse(static_cast<int>(argv.size() - 1), argv.data());
    } catch (const CLI::Error&) {
      // usage errors, --help and --version: main() turns these into exit 0 or 2
    }
  });
  return 0;
}
