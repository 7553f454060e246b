#pragma once
/// "Did you mean": the one spelling-suggestion rule of coldcore, for keys, names, verbs and
/// options alike. Names are compared case-insensitively (ASCII) by optimal-string-alignment edit
/// distance: insert, delete, substitute, or swap two neighbours, each costing 1.
#include <algorithm>
#include <cctype>
#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore {

/// Optimal-string-alignment distance of a and b, ASCII case ignored.
inline std::size_t edit_distance(std::string_view a, std::string_view b) {
  const auto lower = [](char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); };
  const std::size_t n = a.size(), m = b.size();
  // Three rows: the swap rule looks two rows back.
  std::vector<std::size_t> back2(m + 1), back1(m + 1), row(m + 1);
  for (std::size_t j = 0; j <= m; ++j) back1[j] = j;
  for (std::size_t i = 1; i <= n; ++i) {
    row[0] = i;
    for (std::size_t j = 1; j <= m; ++j) {
      const std::size_t cost = lower(a[i - 1]) == lower(b[j - 1]) ? 0 : 1;
      row[j] = std::min({back1[j] + 1, row[j - 1] + 1, back1[j - 1] + cost});
      if (i > 1 && j > 1 && lower(a[i - 1]) == lower(b[j - 2]) && lower(a[i - 2]) == lower(b[j - 1]))
        row[j] = std::min(row[j], back2[j - 2] + 1);
    }
    std::swap(back2, back1);
    std::swap(back1, row);
  }
  return back1[m];
}

/// The candidate nearest to `word` when it is close enough to be a likely typo
/// (distance <= max(2, word.size() / 3)); nullopt otherwise. Ties: the first listed wins.
template <class Names>
std::optional<std::string> did_you_mean(std::string_view word, const Names& candidates) {
  // Names are short: a very long word is no typo of one (and its table would cost memory).
  if (word.size() > 100) return std::nullopt;
  const std::size_t limit = std::max<std::size_t>(2, word.size() / 3);
  std::optional<std::string> best;
  std::size_t best_d = limit + 1;
  for (const auto& c : candidates) {
    const std::string_view name(c);
    // The distance is at least the difference in length.
    const std::size_t gap = word.size() > name.size() ? word.size() - name.size() : name.size() - word.size();
    if (gap >= best_d) continue;
    const std::size_t d = edit_distance(word, name);
    if (d < best_d) {
      best_d = d;
      best = std::string(name);
    }
  }
  return best;
}

inline std::optional<std::string> did_you_mean(std::string_view word, std::initializer_list<std::string_view> candidates) {
  return did_you_mean<std::initializer_list<std::string_view>>(word, candidates);
}

}  // namespace coldcore
