// Reading input files: only regular files, refused before opening otherwise (issue 18).
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <sys/stat.h>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"

using namespace coldcore;
namespace fs = std::filesystem;

TEST_CASE("issue 18: a directory / a FIFO or a missing file is refused with the reason") {
  const fs::path dir = fs::temp_directory_path() / "coldcore-read-file-test";
  fs::remove_all(dir);
  fs::create_directories(dir / "sub");
  const std::string d = dir.generic_string();
  CHECK_THROWS_WITH_AS(io::read_text_file(dir / "sub"),
                       (d + "/sub: cannot read file: it is a directory; give a regular file").c_str(), InputError);
  // A FIFO with no writer would block an open() forever: it must be refused before opening.
  REQUIRE(::mkfifo((dir / "pipe").c_str(), 0600) == 0);
  CHECK_THROWS_WITH_AS(io::read_text_file(dir / "pipe"),
                       (d + "/pipe: cannot read file: it is a FIFO; give a regular file").c_str(), InputError);
  CHECK_THROWS_WITH_AS(io::read_text_file(dir / "none.csv"),
                       (d + "/none.csv: cannot read file: No such file or directory").c_str(), InputError);
  CHECK_THROWS_WITH_AS(io::read_text_file("/dev/null"), "/dev/null: cannot read file: it is a device; give a regular file",
                       InputError);
  std::ofstream(dir / "ok.csv") << "time_s,temp_C\n0,4\n";
  CHECK(io::read_text_file(dir / "ok.csv") == "time_s,temp_C\n0,4\n");
  // A product file whose medium log is a FIFO is refused, not blocked on.
  std::ofstream(dir / "p.toml") << "schema = 1\n[product]\nshape = \"sphere\"\ndiameter_mm = 40\ninitial_C = 4\n"
                                   "[product.properties]\nconductivity_W_mK = 0.5\ndensity_kg_m3 = 1050\n"
                                   "specific_heat_J_kgK = 3500\n[[stage]]\nmedium_log = \"pipe\"\nh_W_m2K = 40\n";
  CHECK_THROWS_AS(io::load_product(dir / "p.toml"), InputError);
  fs::remove_all(dir);
}
