// process/detail/parallel.hpp: every index runs exactly once whatever the thread count, and the
// error reported is the one a serial loop would meet first (lowest index).
#include <doctest/doctest.h>

#include <atomic>
#include <stdexcept>
#include <string>
#include <vector>

#include "process/detail/parallel.hpp"

using coldcore::process::detail::for_each_index;

TEST_CASE("issue 13: for_each_index runs every index once on any thread count") {
  for (unsigned threads : {1u, 2u, 3u, 8u, 0u}) {
    std::vector<std::atomic<int>> runs(37);
    for_each_index(runs.size(), [&](std::size_t i) { runs[i]++; }, threads);
    CAPTURE(threads);
    for (const auto& r : runs) CHECK(r.load() == 1);
  }
  for_each_index(0, [](std::size_t) { FAIL("no index to run"); }, 4);
}

TEST_CASE("issue 13: for_each_index rethrows the lowest failing index after all ran") {
  for (unsigned threads : {1u, 2u, 5u}) {
    std::atomic<int> ran{0};
    try {
      for_each_index(
          10,
          [&](std::size_t i) {
            ran++;
            if (i == 7 || i == 3) throw std::runtime_error("index " + std::to_string(i));
          },
          threads);
      FAIL("no exception");
    } catch (const std::runtime_error& e) {
      CHECK(std::string(e.what()) == "index 3");
    }
    CHECK(ran.load() == 10);
  }
}
