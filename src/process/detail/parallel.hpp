#pragma once
// Independent evaluations (the corners of a --conservative run) spread over the machine's cores.
// The results do not depend on the thread count: each index is computed by the same code whatever
// thread runs it, into its own slot, and errors are rethrown by index order.
#include <algorithm>
#include <atomic>
#include <cstddef>
#include <exception>
#include <functional>
#include <thread>
#include <vector>

namespace coldcore::process::detail {

/// Runs work(i) once for every i in [0, n) on up to `threads` threads (0: the machine's cores),
/// and returns when all have finished. If any work(i) threw, the exception of the lowest such i
/// is rethrown (the others are dropped), as a serial loop that ran every index would report it.
inline void for_each_index(std::size_t n, const std::function<void(std::size_t)>& work, unsigned threads = 0) {
  if (threads == 0) threads = std::max(1u, std::thread::hardware_concurrency());
  const std::size_t workers = std::min<std::size_t>(threads, n);
  std::vector<std::exception_ptr> errors(n);
  std::atomic<std::size_t> next{0};
  const auto drain = [&] {
    for (std::size_t i = next++; i < n; i = next++) {
      try {
        work(i);
      } catch (...) {
        errors[i] = std::current_exception();
      }
    }
  };
  if (workers <= 1) {
    drain();
  } else {
    std::vector<std::thread> pool;
    for (std::size_t w = 1; w < workers; ++w) pool.emplace_back(drain);
    drain();
    for (auto& t : pool) t.join();
  }
  for (const auto& e : errors)
    if (e) std::rethrow_exception(e);
}

}  // namespace coldcore::process::detail
