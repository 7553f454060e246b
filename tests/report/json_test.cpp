// JSON writer: escaping per RFC 8259 §7 and round-trip numbers.
#include <doctest/doctest.h>

#include <cstdlib>
#include <limits>
#include <sstream>

#include "coldcore/report/json.hpp"

using coldcore::JsonWriter;

TEST_CASE("json strings escape quotes / backslashes and control characters (RFC 8259 section 7)") {
  CHECK(JsonWriter::escape("a\"b\\c\n\t\x01") == "\"a\\\"b\\\\c\\n\\t\\u0001\"");
  CHECK(JsonWriter::escape("°C") == "\"°C\"");
}

TEST_CASE("json numbers read back to the same double") {
  for (double x : {0.1, 1.0 / 3.0, 2.404825557695773, 1e-300, -6.02214076e23}) {
    const std::string s = JsonWriter::number(x);
    CHECK(std::strtod(s.c_str(), nullptr) == x);
  }
  CHECK(JsonWriter::number(std::numeric_limits<double>::quiet_NaN()) == "null");
  CHECK(JsonWriter::number(std::numeric_limits<double>::infinity()) == "null");
}

TEST_CASE("json nesting puts commas between members only") {
  std::ostringstream os;
  JsonWriter w(os, 0);
  w.begin_object().key("a").value(1).key("b").begin_array().value("x").value(2.5).end_array()
      .key("c").begin_object().end_object().end_object();
  CHECK(os.str() == "{\"a\":1,\"b\":[\"x\",2.5],\"c\":{}}\n");
}
