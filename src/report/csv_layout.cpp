#include "coldcore/report/csv_layout.hpp"

#include <algorithm>
#include <vector>

#include "coldcore/report/format.hpp"

namespace coldcore {

namespace {

std::vector<std::string_view> lines_of(std::string_view text) {
  std::vector<std::string_view> lines;
  while (!text.empty()) {
    const auto end = text.find('\n');
    lines.push_back(text.substr(0, end));
    if (end == std::string_view::npos) break;
    text.remove_prefix(end + 1);
  }
  return lines;
}

// Cells in a csv line, counting only separators outside double quotes (RFC 4180).
std::size_t cell_count(std::string_view line) {
  std::size_t n = 1;
  bool quoted = false;
  for (char ch : line) {
    if (ch == '"') quoted = !quoted;
    else if (ch == ',' && !quoted) ++n;
  }
  return n;
}

}  // namespace

std::string header_first_csv(std::string_view commented) {
  std::vector<std::string> notes;
  std::vector<std::string_view> table;
  for (std::string_view line : lines_of(commented)) {
    if (line.rfind("# ", 0) == 0 || line == "#") {
      notes.emplace_back(line.substr(line.size() > 1 ? 2 : 1));
    } else {
      table.push_back(line);
    }
  }
  if (table.empty()) table.push_back("");
  std::string out;
  out.reserve(commented.size() + 64);
  out.append(table[0]).append(table[0].empty() ? "notes\n" : ",notes\n");
  const std::size_t columns = table[0].empty() ? 0 : cell_count(table[0]);
  const std::size_t rows = std::max(table.size() - 1, notes.size());
  for (std::size_t i = 0; i < rows; ++i) {
    if (i + 1 < table.size()) {
      out.append(table[i + 1]).append(columns ? "," : "");
    } else {
      out.append(columns, ',');  // an empty cell for each column before notes
    }
    if (i < notes.size()) out.append(csv_cell(notes[i]));
    out.push_back('\n');
  }
  return out;
}

}  // namespace coldcore
