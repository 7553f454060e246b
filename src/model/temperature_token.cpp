#include "coldcore/model/temperature_token.hpp"

#include <cstdio>

namespace coldcore {

namespace {

std::string printf_text(const char* format, int digits, double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, format, digits, v);
  return buf;
}

std::string token(char kind, std::string_view celsius_text, double exact) {
  std::string s(temperature_token::open);
  s += kind;
  s += celsius_text;
  s += temperature_token::separator;
  s += printf_text("%.*g", 17, exact);
  s += temperature_token::close;
  return s;
}

}  // namespace

std::string temp_token(double celsius, int significant) {
  return token('T', printf_text("%.*g", significant, celsius), celsius);
}
std::string temp_difference_token(double kelvin, int significant) {
  return token('D', printf_text("%.*g", significant, kelvin), kelvin);
}
std::string temp_token_fixed(double celsius, int decimals) {
  return token('T', printf_text("%.*f", decimals, celsius), celsius);
}
std::string temp_difference_token_fixed(double kelvin, int decimals) {
  return token('D', printf_text("%.*f", decimals, kelvin), kelvin);
}
std::string temp_token_text(std::string_view celsius_text, double exact_celsius) {
  return token('T', celsius_text, exact_celsius);
}
std::string temp_token_written(std::string_view celsius_text, std::string_view fahrenheit_text, double exact_celsius) {
  std::string s = token('W', celsius_text, exact_celsius);
  s.insert(s.size() - temperature_token::close.size(), std::string(temperature_token::separator) + std::string(fahrenheit_text));
  return s;
}

}  // namespace coldcore
