#pragma once
// Checks shared by the html and markdown writer tests.
#include <string>
#include <vector>

namespace coldcore::testing {

inline size_t count_of(const std::string& s, const std::string& what) {
  size_t n = 0;
  for (size_t p = s.find(what); p != std::string::npos; p = s.find(what, p + 1)) ++n;
  return n;
}

/// Every "http://" or "https://" in `s` that is not the SVG namespace identifier (which names
/// the namespace and is never fetched). Empty means the document links to nothing outside.
inline std::vector<std::string> external_urls(const std::string& s) {
  const std::string ns = "xmlns=\"http://www.w3.org/2000/svg\"";
  std::vector<std::string> found;
  for (const char* scheme : {"http://", "https://"})
    for (size_t p = s.find(scheme); p != std::string::npos; p = s.find(scheme, p + 1)) {
      const bool is_ns = p >= 7 && s.compare(p - 7, ns.size(), ns) == 0;
      if (!is_ns) found.push_back(s.substr(p, 60));
    }
  return found;
}

}  // namespace coldcore::testing
