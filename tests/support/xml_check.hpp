#pragma once
// A small XML 1.0 well-formedness checker for tests (W3C XML 1.0, sections 2.1 "well-formed",
// 3.1 tags, 4.1 references): one root element, tags nested and matched, attribute values
// quoted and unique per element, '<' never in text or values, '&' only as a reference to the
// five predefined entities or a character number. No DTD, namespaces or encodings beyond that.
// Returns "" when well-formed, else the first problem with its byte offset.
#include <cctype>
#include <set>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore::testing {

inline std::string xml_problem(std::string_view s) {
  size_t i = 0;
  std::vector<std::string> stack;
  int roots = 0;
  auto err = [&](const std::string& what) { return what + " at byte " + std::to_string(i); };
  auto is_name_start = [](unsigned char c) { return std::isalpha(c) || c == '_' || c == ':' || c >= 0x80; };
  auto is_name = [&](unsigned char c) { return is_name_start(c) || std::isdigit(c) || c == '-' || c == '.'; };
  auto check_ref = [&](size_t& k) -> bool {  // s[k] == '&'
    const size_t semi = s.find(';', k);
    if (semi == std::string_view::npos || semi - k > 10) return false;
    const std::string_view ref = s.substr(k + 1, semi - k - 1);
    bool ok = ref == "amp" || ref == "lt" || ref == "gt" || ref == "quot" || ref == "apos";
    if (!ok && ref.size() >= 2 && ref[0] == '#') {
      const bool hex = ref[1] == 'x';
      ok = ref.size() > (hex ? 2u : 1u);
      for (size_t j = hex ? 2 : 1; j < ref.size(); ++j)
        ok = ok && (hex ? std::isxdigit(static_cast<unsigned char>(ref[j])) : std::isdigit(static_cast<unsigned char>(ref[j])));
    }
    k = semi;
    return ok;
  };
  auto read_name = [&](std::string& out) -> bool {
    if (i >= s.size() || !is_name_start(static_cast<unsigned char>(s[i]))) return false;
    const size_t b = i;
    while (i < s.size() && is_name(static_cast<unsigned char>(s[i]))) ++i;
    out = std::string(s.substr(b, i - b));
    return true;
  };
  auto skip_ws = [&] { while (i < s.size() && std::isspace(static_cast<unsigned char>(s[i]))) ++i; };

  if (s.substr(0, 5) == "<?xml") {
    const size_t e = s.find("?>");
    if (e == std::string_view::npos) return err("unterminated XML declaration");
    i = e + 2;
  }
  while (i < s.size()) {
    if (s[i] == '<') {
      if (s.substr(i, 4) == "<!--") {
        const size_t e = s.find("-->", i + 4);
        if (e == std::string_view::npos) return err("unterminated comment");
        i = e + 3;
        continue;
      }
      if (s.substr(i, 2) == "<!" || s.substr(i, 2) == "<?") return err("declaration or PI not supported here");
      if (s.substr(i, 2) == "</") {
        i += 2;
        std::string name;
        if (!read_name(name)) return err("bad end-tag name");
        skip_ws();
        if (i >= s.size() || s[i] != '>') return err("end tag not closed");
        ++i;
        if (stack.empty() || stack.back() != name)
          return err("end tag </" + name + "> does not match <" + (stack.empty() ? "" : stack.back()) + ">");
        stack.pop_back();
        continue;
      }
      ++i;
      std::string name;
      if (!read_name(name)) return err("bad start-tag name");
      if (stack.empty() && ++roots > 1) return err("second root element <" + name + ">");
      std::set<std::string> attrs;
      for (;;) {
        const size_t before = i;
        skip_ws();
        if (i >= s.size()) return err("unterminated start tag <" + name + ">");
        if (s[i] == '>') { ++i; stack.push_back(name); break; }
        if (s.substr(i, 2) == "/>") { i += 2; break; }
        if (i == before) return err("attributes need white space between them in <" + name + ">");
        std::string an;
        if (!read_name(an)) return err("bad attribute name in <" + name + ">");
        if (!attrs.insert(an).second) return err("duplicate attribute " + an);
        skip_ws();
        if (i >= s.size() || s[i] != '=') return err("attribute " + an + " without value");
        ++i;
        skip_ws();
        if (i >= s.size() || (s[i] != '"' && s[i] != '\'')) return err("attribute " + an + " not quoted");
        const char q = s[i++];
        while (i < s.size() && s[i] != q) {
          if (s[i] == '<') return err("'<' in attribute " + an);
          if (s[i] == '&' && !check_ref(i)) return err("bad reference in attribute " + an);
          ++i;
        }
        if (i >= s.size()) return err("unterminated attribute " + an);
        ++i;
      }
      continue;
    }
    if (stack.empty() && !std::isspace(static_cast<unsigned char>(s[i]))) return err("text outside the root element");
    if (s[i] == '&' && !check_ref(i)) return err("bad entity reference");
    if (s[i] == '>' && i >= 2 && s.substr(i - 2, 3) == "]]>") return err("']]>' in text");
    ++i;
  }
  if (!stack.empty()) return err("unclosed <" + stack.back() + ">");
  if (roots != 1) return err("no root element");
  return "";
}

}  // namespace coldcore::testing
