// Temperatures inside free text: tokens written in the display unit.
// Conversion by the definition of the Fahrenheit scale: °F = °C × 9/5 + 32, and a temperature
// difference converts by 9/5 only (common practice; e.g. the FDA's z of 10 °C is 18 °F).
#include <doctest/doctest.h>

#include <string>

#include "coldcore/report/temperature_text.hpp"

using namespace coldcore;

TEST_CASE("temperature tokens render in °C as written and in °F by the scale's definition") {
  const std::string label = temp_token(57) + " -> " + temp_token(21);
  CHECK(render_temperatures(label, TempUnit::C) == "57 °C -> 21 °C");
  // 57 °C = 134.6 °F and 21 °C = 69.8 °F (57·1.8 + 32, 21·1.8 + 32)
  CHECK(render_temperatures(label, TempUnit::F) == "134.6 °F -> 69.8 °F");
  // 5 °C = 41 °F exactly: trailing zeros dropped; one more decimal than the °C text had
  CHECK(render_temperatures("to " + temp_token(5), TempUnit::F) == "to 41 °F");
  CHECK(render_temperatures(temp_token_fixed(4.04, 2), TempUnit::F) == "39.272 °F");
  // a °C text with five decimals keeps five in °F: 3.87611 °C = 38.976998 °F -> 38.97700 -> 38.977
  CHECK(render_temperatures(temp_token(3.87611), TempUnit::F) == "38.977 °F");
  CHECK(render_temperatures(temp_token_fixed(70, 1), TempUnit::C) == "70.0 °C");
  CHECK(render_temperatures(temp_token_fixed(70, 1), TempUnit::F) == "158 °F");
  // −40 is the same on both scales
  CHECK(render_temperatures(temp_token(-40), TempUnit::F) == "-40 °F");
  // differences: z 10 °C is 18 °F (no offset)
  CHECK(render_temperatures("z " + temp_difference_token(10), TempUnit::F) == "z 18 °F");
  CHECK(render_temperatures("z " + temp_difference_token_fixed(7.5, 2), TempUnit::C) == "z 7.50 °C");
}

TEST_CASE("text without tokens / or with a broken token / passes unchanged") {
  CHECK(render_temperatures("plain 57 C text", TempUnit::F) == "plain 57 C text");
  const std::string broken = "\xEE\x80\x80T57 and no end";
  CHECK(render_temperatures(broken, TempUnit::F) == broken);
  // tokens inside JSON-escaped or HTML-escaped text survive (non-ASCII passes both escapers)
  std::string two = "[";
  two += temp_token(63) + "," + temp_token(74) + "]";
  CHECK(render_temperatures(two, TempUnit::F) == "[145.4 °F,165.2 °F]");
}

TEST_CASE("°F comes from the exact value / not from the rounded °C text") {
  // FSIS Appendix B limits are set in °F: 130 °F = 54.444 °C, shown as 54.4 °C; in °F it is 130.
  const double c130 = (130.0 - 32.0) / 1.8;
  CHECK(render_temperatures(temp_token_text("54.4", c130), TempUnit::C) == "54.4 °C");
  CHECK(render_temperatures(temp_token_text("54.4", c130), TempUnit::F) == "130 °F");
}
