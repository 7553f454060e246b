#include "coldcore/report/json.hpp"

#include <cassert>
#include <charconv>
#include <cmath>
#include <cstdio>

namespace coldcore {

std::string JsonWriter::escape(std::string_view s) {
  std::string r;
  r.reserve(s.size() + 2);
  r += '"';
  for (unsigned char c : s) {
    switch (c) {
      case '"': r += "\\\""; break;
      case '\\': r += "\\\\"; break;
      case '\n': r += "\\n"; break;
      case '\r': r += "\\r"; break;
      case '\t': r += "\\t"; break;
      default:
        if (c < 0x20) {
          char buf[8];
          std::snprintf(buf, sizeof buf, "\\u%04x", c);
          r += buf;
        } else {
          r += static_cast<char>(c);  // UTF-8 passes through unchanged
        }
    }
  }
  r += '"';
  return r;
}

std::string JsonWriter::number(double x) {
  if (!std::isfinite(x)) return "null";
  char buf[64];
  // std::to_chars gives the shortest representation that round-trips.
  auto res = std::to_chars(buf, buf + sizeof buf, x);
  return std::string(buf, res.ptr);
}

void JsonWriter::newline() {
  if (indent_ <= 0) return;
  out_ << '\n' << std::string(stack_.size() * static_cast<size_t>(indent_), ' ');
}

void JsonWriter::before_value() {
  if (after_key_) {
    after_key_ = false;
    return;
  }
  if (!stack_.empty()) {
    assert(!stack_.back().is_object && "a value inside an object needs a key first");
    if (!stack_.back().empty) out_ << ',';
    stack_.back().empty = false;
    newline();
  }
}

JsonWriter& JsonWriter::begin_object() {
  before_value();
  out_ << '{';
  stack_.push_back({true, true});
  return *this;
}

JsonWriter& JsonWriter::end_object() {
  assert(!stack_.empty() && stack_.back().is_object);
  const bool empty = stack_.back().empty;
  stack_.pop_back();
  if (!empty) newline();
  out_ << '}';
  if (stack_.empty()) out_ << '\n';
  return *this;
}

JsonWriter& JsonWriter::begin_array() {
  before_value();
  out_ << '[';
  stack_.push_back({false, true});
  return *this;
}

JsonWriter& JsonWriter::end_array() {
  assert(!stack_.empty() && !stack_.back().is_object);
  const bool empty = stack_.back().empty;
  stack_.pop_back();
  if (!empty) newline();
  out_ << ']';
  if (stack_.empty()) out_ << '\n';
  return *this;
}

JsonWriter& JsonWriter::key(std::string_view k) {
  assert(!stack_.empty() && stack_.back().is_object);
  if (!stack_.back().empty) out_ << ',';
  stack_.back().empty = false;
  newline();
  out_ << escape(k) << (indent_ > 0 ? ": " : ":");
  after_key_ = true;
  return *this;
}

JsonWriter& JsonWriter::value(std::string_view s) {
  before_value();
  out_ << escape(s);
  return *this;
}

JsonWriter& JsonWriter::value(double x) {
  before_value();
  out_ << number(x);
  return *this;
}

JsonWriter& JsonWriter::value(int x) {
  before_value();
  out_ << x;
  return *this;
}

JsonWriter& JsonWriter::value(bool b) {
  before_value();
  out_ << (b ? "true" : "false");
  return *this;
}

JsonWriter& JsonWriter::null() {
  before_value();
  out_ << "null";
  return *this;
}

JsonWriter& JsonWriter::value(const std::vector<std::string>& items) {
  begin_array();
  for (const auto& s : items) value(std::string_view(s));
  return end_array();
}

}  // namespace coldcore
