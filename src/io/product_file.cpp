#include "coldcore/io/product_file.hpp"

#include <cerrno>
#include <cstring>
#include <mutex>

#include <array>
#include <cmath>
#include <fstream>
#include <iostream>
#include <limits>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/io/calibration_file.hpp"
#include "coldcore/io/can_size.hpp"
#include "coldcore/io/sha256.hpp"
#include "coldcore/model/limits.hpp"
#include "io/detail/fields.hpp"
#include "io/detail/product_parts.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

namespace {

using detail::Fields;
using detail::Found;
using detail::format_number;
using detail::plain;
using detail::quantity;
using detail::quote;


struct ShapeName {
  std::string_view name;
  Shape shape;
};
constexpr std::array<ShapeName, 5> kShapes = {{{"sphere", Shape::sphere},
                                               {"cylinder", Shape::cylinder},
                                               {"finite-cylinder", Shape::finite_cylinder},
                                               {"slab", Shape::slab},
                                               {"brick", Shape::brick}}};

/// A required positive length.
double positive_length(const Fields& f, std::string_view base, const std::string& why) {
  Found found;
  const auto v = f.quantity_si(base, &found);
  if (!v) f.missing(std::string(base) + "_*", why + " (" + detail::spellings(base, Quantity::length) + ", > 0)");
  if (!(*v > 0)) f.fail(found.key, "must be > 0");
  f.require_range(found.key, *v, limits::length_m, Quantity::length, found.unit);
  return *v;
}

Shape parse_shape(const Fields& f) {
  const auto s = f.string("shape");
  if (!s) f.missing("shape", "one of sphere, cylinder, finite-cylinder, slab, brick");
  for (const auto& sn : kShapes)
    if (sn.name == *s) return sn.shape;
  std::vector<std::string> names;
  for (const auto& sn : kShapes) names.emplace_back(sn.name);
  std::string msg = "unknown shape; ";
  if (auto near = did_you_mean(*s, names)) msg += "did you mean " + quote(*near) + "? ";
  f.fail("shape", msg + "accepted: sphere, cylinder, finite-cylinder, slab, brick");
}

ThermalProperties parse_properties(const toml::table& t, const std::string& origin) {
  Fields f(t, origin, "product.properties",
           {quantity("conductivity", Quantity::conductivity), quantity("density", Quantity::density),
            quantity("specific_heat", Quantity::specific_heat)});
  ThermalProperties p;
  // SI or US customary spellings (io/quantity.hpp), converted here; the range is said in the
  // unit as written.
  const auto get = [&](std::string_view base, Quantity q, const limits::Range& plausible) {
    const auto fd = f.find(base);
    if (!fd) f.missing(std::string(base) + "_*", std::string(quantity_name(q)) + " (" + detail::spellings(base, q) + "), > 0");
    const double written = f.number_of(fd->key, *fd->node, false, std::string(quantity_name(q)) + " in " + std::string(unit_text(fd->unit)));
    if (!(written > 0)) f.fail(fd->key, "must be > 0");
    const double si = *to_si(q, written, fd->unit);
    f.require_range(fd->key, si, plausible, q, fd->unit);
    return si;
  };
  p.conductivity_W_mK = get("conductivity", Quantity::conductivity, limits::conductivity_W_mK);
  p.density_kg_m3 = get("density", Quantity::density, limits::density_kg_m3);
  p.specific_heat_J_kgK = get("specific_heat", Quantity::specific_heat, limits::specific_heat_J_kgK);
  return p;
}

MassFractions parse_composition(const toml::table& t, const std::string& origin) {
  Fields f(t, origin, "product.composition",
           {plain("water"), plain("protein"), plain("fat"), plain("carbohydrate"), plain("fiber"), plain("ash")});
  MassFractions m;
  double sum = 0;
  const auto get = [&](std::string_view key, double& out) {
    const toml::node* n = f.node(key);
    if (n == nullptr) return;
    out = f.number_of(key, *n, false, "mass fraction");
    if (!(out >= 0 && out <= 1)) f.fail(key, "must be a mass fraction in [0, 1]");
    sum += out;
  };
  if (f.node("water") == nullptr) f.missing("water", "a mass fraction in [0, 1]");
  get("water", m.water);
  get("protein", m.protein);
  get("fat", m.fat);
  get("carbohydrate", m.carbohydrate);
  get("fiber", m.fiber);
  get("ash", m.ash);
  if (std::abs(sum - 1.0) > composition_sum_tolerance)
    throw InputError(origin + ": product.composition = " + detail::format_value(t) +
                     ": the mass fractions must sum to 1 (within " + format_number(composition_sum_tolerance) +
                     "); they sum to " + format_number(sum));
  return m;
}

/// [product.ranges]: each key a [low, high] pair in its unit, containing the nominal value.
ProductRanges parse_ranges(const toml::table& t, const std::string& origin, const Product& p, bool has_k) {
  Fields f(t, origin, "product.ranges",
           {quantity("diameter", Quantity::length), quantity("length", Quantity::length),
            quantity("thickness", Quantity::length), quantity("conductivity", Quantity::conductivity),
            quantity("initial", Quantity::temperature)});
  ProductRanges r;
  const auto pair = [&](const std::string& key, const toml::node& n, const std::string& unit, Quantity q, bool is_q,
                        double nominal, bool positive, const limits::Range* plausible) -> std::array<double, 2> {
    const std::string need = "must be [low, high] with low <= high" + std::string(positive ? ", low > 0" : "");
    const toml::array* a = n.as_array();
    if (a == nullptr || a->size() != 2 || !a->get(0)->is_number() || !a->get(1)->is_number()) f.fail(key, need);
    double lo = a->get(0)->value<double>().value_or(0), hi = a->get(1)->value<double>().value_or(0);
    if (is_q) {
      lo = *to_si(q, lo, unit);
      hi = *to_si(q, hi, unit);
    }
    if (!(lo <= hi) || !std::isfinite(lo) || !std::isfinite(hi) || (positive && !(lo > 0))) f.fail(key, need);
    if (plausible && !(plausible->contains(lo) && plausible->contains(hi)))
      f.fail(key, "both ends must be " + detail::range_text(*plausible, is_q ? std::optional(q) : std::nullopt,
                                                            unit));
    if (nominal < lo - 1e-12 * std::abs(nominal) || nominal > hi + 1e-12 * std::abs(nominal))
      f.fail(key, "must contain the nominal value " + format_number(nominal) + " (SI)");
    return {lo, hi};
  };
  const auto length = [&](const char* base, double nominal, std::optional<std::array<double, 2>>& out) {
    if (auto fd = f.find(base)) {
      if (!(nominal > 0)) f.fail(fd->key, "not used by shape = " + quote(to_string(p.shape)));
      out = pair(fd->key, *fd->node, fd->unit, Quantity::length, true, nominal, true, &limits::length_m);
    }
  };
  length("diameter", p.dims.diameter_m, r.diameter_m);
  length("length", p.dims.length_m, r.length_m);
  length("thickness", p.dims.thickness_m, r.thickness_m);
  if (auto fk = f.find("conductivity")) {
    if (!has_k) f.fail(fk->key, "needs [product.properties] (a composition gives k itself)");
    r.conductivity_W_mK = pair(fk->key, *fk->node, fk->unit, Quantity::conductivity, true, p.properties.conductivity_W_mK, true,
                               &limits::conductivity_W_mK);
  }
  if (auto fi = f.find("initial")) r.initial_C = pair(fi->key, *fi->node, fi->unit, Quantity::temperature, true, p.initial_C, false,
                                   &limits::temperature_C);
  return r;
}

Product parse_product_table(const toml::table& t, const std::string& origin, std::optional<MassFractions>& comp) {
  Fields f(t, origin, "product",
           {plain("name"), plain("shape"), quantity("diameter", Quantity::length),
            quantity("length", Quantity::length), quantity("thickness", Quantity::length),
            quantity("size", Quantity::length), quantity("initial", Quantity::temperature), plain("properties"),
            plain("composition"), plain("ranges"), plain("can_size")});
  Product p;
  const auto name = f.string("name");
  if (!name) f.missing("name", "a name for reports, in double quotes");
  if (name->empty()) f.fail("name", "must not be empty");
  p.name = *name;
  p.shape = parse_shape(f);
  const std::string shape_text = "shape = " + quote(to_string(p.shape));

  // Dimensions a shape does not use are refused, not ignored: a slab given a diameter is
  // most likely the wrong shape.
  const auto refuse_unused = [&](std::string_view base, const std::string& hint) {
    if (auto fd = f.find(base)) f.fail(fd->key, "not used by " + shape_text + hint);
  };
  if (p.shape != Shape::finite_cylinder && f.node("can_size") != nullptr)
    f.fail("can_size", "not used by " + shape_text + " (a can is shape = \"finite-cylinder\")");
  switch (p.shape) {
    case Shape::sphere:
    case Shape::cylinder:
      p.dims.diameter_m = positive_length(f, "diameter", shape_text + " needs a diameter");
      refuse_unused("length", p.shape == Shape::cylinder
                                  ? " (an infinite cylinder has no length; use shape = \"finite-cylinder\")"
                                  : "");
      refuse_unused("thickness", "");
      refuse_unused("size", "");
      break;
    case Shape::finite_cylinder:
      if (auto can = f.string("can_size")) {
        // The overall (outside) size: larger than the contents, so it errs on the slow side.
        std::string why;
        const auto size = parse_can_size(*can, &why);
        if (!size) f.fail("can_size", why);
        if (auto fd = f.find("diameter")) f.fail(fd->key, "given together with can_size; give one");
        if (auto fd = f.find("length")) f.fail(fd->key, "given together with can_size; give one");
        p.dims.diameter_m = size->diameter_m;
        p.dims.length_m = size->height_m;
      } else {
        p.dims.diameter_m = positive_length(f, "diameter", shape_text + " needs a diameter (or can_size = \"211 x 400\")");
        p.dims.length_m = positive_length(f, "length", shape_text + " needs a length");
      }
      refuse_unused("thickness", "");
      refuse_unused("size", "");
      break;
    case Shape::slab:
      p.dims.thickness_m = positive_length(f, "thickness", shape_text + " needs a full thickness");
      refuse_unused("diameter", "");
      refuse_unused("length", "");
      refuse_unused("size", "");
      break;
    case Shape::brick: {
      const auto fd = f.find("size");
      if (!fd) f.missing("size_*", shape_text + " needs size_mm = [a, b, c] or size_m = [a, b, c], each > 0");
      const std::string need = "must be 3 numbers [a, b, c] (full edge lengths in " + fd->unit + "), each > 0";
      const toml::array* a = fd->node->as_array();
      if (a == nullptr || a->size() != 3) f.fail(fd->key, need);
      for (std::size_t i = 0; i < 3; ++i) {
        const toml::node& el = *a->get(i);
        if (!el.is_number()) f.fail(fd->key, need);
        const double v = el.value<double>().value_or(0);
        if (!(v > 0) || !std::isfinite(v)) f.fail(fd->key, need);
        p.dims.size_m[i] = *to_si(Quantity::length, v, fd->unit);
        if (!limits::length_m.contains(p.dims.size_m[i]))
          f.fail(fd->key, "each edge must be " + detail::range_text(limits::length_m, Quantity::length, fd->unit));
      }
      refuse_unused("diameter", "");
      refuse_unused("length", "");
      refuse_unused("thickness", "");
      break;
    }
  }

  Found fi;
  const auto initial = f.quantity_si("initial", &fi);
  if (!initial) f.missing("initial_*", "the uniform initial temperature (initial_C or initial_F)");
  if (*initial < limits::absolute_zero_C) f.fail(fi.key, "below absolute zero (-273.15 C, -459.67 F)");
  f.require_range(fi.key, *initial, limits::temperature_C, Quantity::temperature, fi.unit);
  p.initial_C = *initial;

  const toml::node* props = f.node("properties");
  const toml::node* compo = f.node("composition");
  if (props != nullptr && compo != nullptr) f.fail("composition", "given together with [product.properties]; give one");
  if (props == nullptr && compo == nullptr)
    f.missing("properties", "give [product.properties] (conductivity_W_mK, density_kg_m3, specific_heat_J_kgK) "
                            "or [product.composition] (mass fractions)");
  if (props != nullptr) {
    if (!props->is_table()) f.fail("properties", "must be a table [product.properties]");
    p.properties = parse_properties(*props->as_table(), origin);
  } else {
    if (!compo->is_table()) f.fail("composition", "must be a table [product.composition]");
    comp = parse_composition(*compo->as_table(), origin);
  }
  return p;
}

}  // namespace

ProductFile parse_product(std::string_view toml_text, std::string_view origin_sv,
                          const std::filesystem::path& base_dir, const LogReader& read_log) {
  const std::string origin(origin_sv);
  const toml::table doc = detail::parse_toml(toml_text, origin);

  ProductFile out;
  out.origin = origin;
  out.sha256_hex = sha256_hex(toml_text);

  // The schema first: keys of another schema would only produce confusing messages.
  const toml::node* schema = doc.get("schema");
  if (schema == nullptr) throw InputError(origin + ": schema: missing: must be 1 (write schema = 1 at the top)");
  if (!schema->is_integer() || schema->as_integer()->get() != 1)
    throw InputError(origin + ": schema = " + detail::format_value(*schema) +
                     ": must be 1 (the only product-file schema this coldcore reads)");

  Fields root(doc, origin, "",
              {plain("schema"), plain("product"), plain("stage"), plain("target"), plain("calibration")});
  const toml::node* product = root.node("product");
  if (product == nullptr) root.missing("product", "a [product] table (name, shape, size, initial temperature, properties)");
  if (!product->is_table()) root.fail("product", "must be a table [product]");
  out.product = parse_product_table(*product->as_table(), origin, out.composition);
  if (const toml::node* rg = product->as_table()->get("ranges")) {
    if (!rg->is_table())
      throw InputError(origin + ": product.ranges = " + detail::format_value(*rg) + ": must be a table [product.ranges]");
    out.ranges = parse_ranges(*rg->as_table(), origin, out.product, !out.composition.has_value());
  }

  detail::parse_stages(root, base_dir, read_log, out);
  detail::parse_targets(root, out);
  if (const toml::node* cal = root.node("calibration")) {
    if (!cal->is_table()) root.fail("calibration", "must be a table [calibration] (written by coldcore fit)");
    out.calibration = parse_calibration(*cal->as_table(), origin);
    if (!out.composition) check_calibration(*out.calibration, out.product, out.stages, origin);
  }
  return out;
}

namespace {
std::mutex& inputs_mutex() {
  static std::mutex m;
  return m;
}
std::vector<std::filesystem::path>& inputs_list() {
  static std::vector<std::filesystem::path> files;
  return files;
}
}  // namespace

namespace {
// "-": standard input (a pipe), read to its end within the same size limit as a file.
std::string read_standard_input() {
  std::string text;
  char buf[65536];
  while (std::cin.read(buf, sizeof buf) || std::cin.gcount() > 0) {
    text.append(buf, static_cast<std::size_t>(std::cin.gcount()));
    if (text.size() > kMaxInputFileBytes)
      throw InputError("standard input: more than the limit of " + std::to_string(kMaxInputFileBytes) + " bytes");
  }
  if (std::cin.bad()) throw InputError("standard input: a read error occurred");
  return text;
}
}  // namespace

std::string read_text_file(const std::filesystem::path& path) {
  namespace fs = std::filesystem;
  if (path == "-") return read_standard_input();
  const std::string where = path.generic_string() + ": cannot read file: ";
  // Look before opening: opening a FIFO blocks until a writer appears, and a device never ends.
  std::error_code ec;
  const fs::file_status st = fs::status(path, ec);
  if (ec) throw InputError(where + ec.message());
  if (fs::is_directory(st)) throw InputError(where + "it is a directory; give a regular file");
  if (!fs::is_regular_file(st)) {
    const char* what = fs::is_fifo(st) ? "a FIFO" : fs::is_socket(st) ? "a socket"
                     : (fs::is_character_file(st) || fs::is_block_file(st)) ? "a device" : "not a plain file";
    throw InputError(where + "it is " + what + "; give a regular file");
  }
  const auto size = fs::file_size(path, ec);
  if (!ec && size > kMaxInputFileBytes)
    throw InputError(where + std::to_string(size) + " bytes is over the limit of " +
                     std::to_string(kMaxInputFileBytes) + " bytes");
  errno = 0;
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(where + (errno != 0 ? std::strerror(errno) : "cannot open it"));
  std::ostringstream ss;
  ss << in.rdbuf();
  if (in.bad()) throw InputError(where + "a read error occurred");
  {
    const std::lock_guard lock(inputs_mutex());
    inputs_list().push_back(path);
  }
  return ss.str();
}

std::vector<std::filesystem::path> inputs_read() {
  const std::lock_guard lock(inputs_mutex());
  return inputs_list();
}

void require_constant_properties(const ProductFile& file) {
  if (file.composition && !(file.product.properties.conductivity_W_mK > 0))
    throw InputError(file.origin +
                     ": product.composition: run, solve and deviation need constant [product.properties] "
                     "(k, rho, cp); temperature-dependent properties from a composition are not wired into them "
                     "yet; `coldcore props --composition ...` lists the Choi-Okos values to choose from");
}

ProductFile load_product(const std::filesystem::path& path) {
  const std::string text = read_text_file(path);
  // Throws with the reason (missing, a directory, a FIFO, too large); the stage reader adds its key.
  const LogReader disk = [](const std::filesystem::path& p) -> std::optional<std::string> { return read_text_file(p); };
  ProductFile pf = parse_product(text, path.generic_string(), path.parent_path(), disk);
  if (needs_media(pf)) {
    const std::filesystem::path mp = path.parent_path() / "media.toml";
    std::string media_text;
    try {
      media_text = read_text_file(mp);
    } catch (const InputError& e) {
      throw InputError(path.generic_string() + ": medium_type: needs " + mp.generic_string() +
                       " (the media library) beside the product file: " + e.what());
    }
    apply_media(pf, parse_media(media_text, mp.generic_string()));
  }
  return pf;
}

}  // namespace coldcore::io
