// SHA-256 against published vectors and an independent implementation.
#include <doctest/doctest.h>

#include <fstream>
#include <string>

#include "coldcore/io/sha256.hpp"

using coldcore::io::sha256_hex;

TEST_CASE("sha256: FIPS 180-2 example vectors") {
  // FIPS 180-2 Appendix B.1 "abc", B.2 the 448-bit message, B.3 one million 'a'; and the empty
  // string (NIST example list). Digests from memory, confirmed with coreutils sha256sum.
  CHECK(sha256_hex("abc") == "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  CHECK(sha256_hex("") == "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  CHECK(sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq") ==
        "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
  CHECK(sha256_hex(std::string(1000000, 'a')) ==
        "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
}

TEST_CASE("sha256: every length 0..200 matches hashlib (tests/reference/sha256_lengths.csv)") {
  std::ifstream in(COLDCORE_SOURCE_DIR "/tests/reference/sha256_lengths.csv");
  REQUIRE(in);
  std::string line;
  int rows = 0;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    const auto comma = line.find(',');
    const std::size_t n = std::stoul(line.substr(0, comma));
    std::string msg;
    for (std::size_t i = 0; i < n; ++i) msg += static_cast<char>((7 * i + 3) % 256);
    INFO("n = " << n);
    CHECK(sha256_hex(msg) == line.substr(comma + 1));
    ++rows;
  }
  CHECK(rows == 201);
}
