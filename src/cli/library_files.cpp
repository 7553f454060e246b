#include "coldcore/io/libraries.hpp"
#include "cli/library_files.hpp"

#include <cstdlib>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/sha256.hpp"

namespace coldcore::cli {

std::filesystem::path library_path(const std::string& name, const std::string& library_dir,
                                   const std::string& product_file) {
  namespace fs = std::filesystem;
  if (!library_dir.empty()) {
    const fs::path p = fs::path(library_dir) / name;
    if (!fs::exists(p)) throw InputError("--library = " + library_dir + ": has no " + name);
    return p;
  }
  if (!product_file.empty()) {
    const fs::path beside = fs::path(product_file).parent_path() / name;
    if (fs::exists(beside)) return beside;
  }
  if (const char* env = std::getenv("COLDCORE_DATA_DIR"); env != nullptr && *env != '\0') {
    const fs::path p = fs::path(env) / name;
    if (fs::exists(p)) return p;
  }
  // An installed executable (P/bin/coldcore) reads P/share/coldcore.
  std::error_code ec;
  const fs::path exe = fs::read_symlink("/proc/self/exe", ec);
  if (!ec) {
    const fs::path installed = exe.parent_path().parent_path() / COLDCORE_DATA_SUBDIR / name;
    if (fs::exists(installed)) return installed;
  }
  const fs::path src = fs::path(COLDCORE_SOURCE_DIR) / "products" / name;
  if (fs::exists(src)) {
    // Shown in reports: relative to the working folder when inside it, as a product file is.
    const fs::path near = src.lexically_proximate(fs::current_path(ec));
    return !ec && !near.empty() && *near.begin() != ".." ? near : src;
  }
  throw InputError(name + ": not found beside the product file, in $COLDCORE_DATA_DIR, in " COLDCORE_DATA_SUBDIR
                   " beside the executable's folder nor in " + src.parent_path().generic_string() +
                   "; give --library DIR");
}

const char* const kLibrarySearchOrder =
    "--library DIR, else beside the product file (or the log), else $COLDCORE_DATA_DIR, else "
    "share/coldcore beside the executable's folder (installed), else the source tree's products/";

void add_library_option(CLI::App& sub, std::string& library_dir) {
  sub.add_option("--library", library_dir,
                 std::string("folder with the data libraries (organisms.toml, cooling-rules.toml, cooking-tables.toml, "
                             "media.toml); searched: ") + kLibrarySearchOrder);
}

LibraryFiles load_libraries(const std::string& library_dir, const std::string& product_file) {
  LibraryFiles d;
  const auto op = library_path("organisms.toml", library_dir, product_file);
  const auto rp = library_path("cooling-rules.toml", library_dir, product_file);
  const std::string ot = io::read_text_file(op), rt = io::read_text_file(rp);
  d.organisms = io::parse_organisms(ot, op.generic_string());
  d.rules = io::parse_cooling_rules(rt, rp.generic_string());
  const auto cp = library_path("cooking-tables.toml", library_dir, product_file);
  const std::string ct = io::read_text_file(cp);
  d.cooking = io::parse_cooking_tables(ct, cp.generic_string());
  d.cooking_sha256 = io::sha256_hex(ct);
  d.organisms_sha256 = io::sha256_hex(ot);
  d.rules_sha256 = io::sha256_hex(rt);
  return d;
}

std::vector<KeyValue> library_provenance(const LibraryFiles& libs, bool names_only) {
  auto shown = [names_only](const std::string& origin) {
    return names_only ? std::filesystem::path(origin).filename().string() : origin;
  };
  return {{"organisms", shown(libs.organisms.origin) + " (SHA-256 " + libs.organisms_sha256 + ")"},
          {"cooling rules", shown(libs.rules.origin) + " (SHA-256 " + libs.rules_sha256 + ")"},
          {"cooking tables", shown(libs.cooking.origin) + " (SHA-256 " + libs.cooking_sha256 + ")"}};
}

}  // namespace coldcore::cli
