#pragma once
/// A small streaming JSON writer: enough for our reports, strict about escaping, and numbers
/// with 17 significant digits so a double survives a round trip. Non-finite numbers are written
/// as null (JSON has no NaN or Infinity); writers that need ∞ write a string instead.
#include <ostream>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore {

class JsonWriter {
 public:
  explicit JsonWriter(std::ostream& out, int indent = 2) : out_(out), indent_(indent) {}

  JsonWriter& begin_object();
  JsonWriter& end_object();
  JsonWriter& begin_array();
  JsonWriter& end_array();
  /// The key of the next value in the current object.
  JsonWriter& key(std::string_view k);
  JsonWriter& value(std::string_view s);
  JsonWriter& value(const char* s) { return value(std::string_view(s)); }
  JsonWriter& value(double x);
  JsonWriter& value(int x);
  JsonWriter& value(bool b);
  JsonWriter& null();
  /// An array of strings in one call.
  JsonWriter& value(const std::vector<std::string>& items);

  static std::string escape(std::string_view s);
  /// Shortest text of x that reads back to the same double (up to 17 significant digits).
  static std::string number(double x);

 private:
  void before_value();
  void newline();
  std::ostream& out_;
  int indent_;
  struct Level { bool is_object; bool empty; };
  std::vector<Level> stack_;
  bool after_key_ = false;
};

}  // namespace coldcore
