#pragma once
// A line on stderr that says the tool is still working, for a verb that runs longer than ~2 s.
// Only when stderr is a terminal: a pipe, a file or a CI log gets nothing.
#include <condition_variable>
#include <mutex>
#include <string>
#include <thread>

namespace coldcore::cli {

/// While alive: after `delay_s` seconds, and then every second, rewrites one stderr line
/// "coldcore <verb>: working, N s elapsed"; the line is erased when the object is destroyed.
/// $COLDCORE_PROGRESS_AFTER_S, when set to a number from 0 to 60, replaces the delay (for tests).
class ProgressLine {
 public:
  explicit ProgressLine(std::string verb, double delay_s = 2.0);
  ~ProgressLine();
  ProgressLine(const ProgressLine&) = delete;
  ProgressLine& operator=(const ProgressLine&) = delete;

 private:
  void run();

  std::string verb_;
  double delay_s_;
  bool done_ = false;
  bool shown_ = false;
  std::mutex mutex_;
  std::condition_variable wake_;
  std::thread thread_;
};

}  // namespace coldcore::cli
