#include "coldcore/report/json_contract.hpp"

#include <charconv>
#include <cmath>

#include "coldcore/version.hpp"

namespace coldcore {

void write_json_envelope(JsonWriter& w, std::string_view verb, TempUnit u) {
  w.key("schema_version").value(kJsonSchemaVersion);
  w.key("tool").value(std::string("coldcore ") + kVersion);
  w.key("verb").value(verb);
  w.key("units").value(unit_suffix(u));
}

std::string json_key(std::string_view label) {
  std::string key;
  bool gap = false;
  for (std::size_t i = 0; i < label.size(); ++i) {
    if (label.substr(i, 7) == "SHA-256") {  // the digest's name reads as one word in a key
      key += (key.empty() || !gap ? "" : "_");
      key += "sha256";
      gap = false;
      i += 6;
      continue;
    }
    const char ch = label[i];
    const bool alnum = (ch >= 'a' && ch <= 'z') || (ch >= 'A' && ch <= 'Z') || (ch >= '0' && ch <= '9');
    if (!alnum) {
      gap = true;
      continue;
    }
    if (gap && !key.empty()) key += '_';
    gap = false;
    key += (ch >= 'A' && ch <= 'Z') ? static_cast<char>(ch - 'A' + 'a') : ch;
  }
  return key;
}

void write_label_value(JsonWriter& w, std::string_view text) {
  double x = 0;
  const char* end = text.data() + text.size();
  const auto res = std::from_chars(text.data(), end, x);
  // Only a number written as we would write it: "0412" (a lot, an id) stays text.
  if (!text.empty() && res.ec == std::errc() && res.ptr == end && std::isfinite(x) && JsonWriter::number(x) == text)
    w.value(x);
  else
    w.value(text);
}

}  // namespace coldcore
