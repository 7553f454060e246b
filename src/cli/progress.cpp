#include "cli/progress.hpp"

#include <unistd.h>

#include <chrono>
#include <cstdio>
#include <cstdlib>

namespace coldcore::cli {

ProgressLine::ProgressLine(std::string verb, double delay_s) : verb_(std::move(verb)), delay_s_(delay_s) {
  if (const char* env = std::getenv("COLDCORE_PROGRESS_AFTER_S"); env != nullptr) {
    char* end = nullptr;
    const double v = std::strtod(env, &end);
    if (end != env && *end == '\0' && v >= 0 && v <= 60) delay_s_ = v;
  }
  if (isatty(STDERR_FILENO) == 1) thread_ = std::thread([this] { run(); });
}

ProgressLine::~ProgressLine() {
  if (!thread_.joinable()) return;
  {
    const std::lock_guard lock(mutex_);
    done_ = true;
  }
  wake_.notify_all();
  thread_.join();
}

void ProgressLine::run() {
  using clock = std::chrono::steady_clock;
  const auto start = clock::now();
  auto next = start + std::chrono::duration_cast<clock::duration>(std::chrono::duration<double>(delay_s_));
  std::unique_lock lock(mutex_);
  while (!wake_.wait_until(lock, next, [this] { return done_; })) {
    const auto elapsed = std::chrono::duration_cast<std::chrono::seconds>(clock::now() - start).count();
    // \r and erase-to-end-of-line: one line rewritten in place.
    std::fprintf(stderr, "\rcoldcore %s: working, %lld s elapsed\033[K", verb_.c_str(), static_cast<long long>(elapsed));
    std::fflush(stderr);
    shown_ = true;
    next += std::chrono::seconds(1);
  }
  if (shown_) {
    std::fputs("\r\033[K", stderr);
    std::fflush(stderr);
  }
}

}  // namespace coldcore::cli
