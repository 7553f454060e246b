#include "io/detail/sourced.hpp"

namespace coldcore::io::detail {

namespace {

// How a sourced value is written, for messages.
constexpr std::string_view kSourcedForm = "{ value = <number>, source = \"...\", status = \"...\" }";

}  // namespace

std::string source_status(const Fields& f) {
  const std::string status = f.required_string("status", "\"confirmed\", \"derived\" or \"from memory\"");
  if (status != "confirmed" && status != "derived" && status != "from memory")
    f.fail("status", "must be \"confirmed\", \"derived\" or \"from memory\"");
  return status;
}

EntryHeading entry_heading(const Fields& f, std::set<std::string>& seen, std::string_view thing,
                           std::string_view source_is) {
  EntryHeading h;
  h.key = f.required_string("key", std::string(thing) + "'s key, in double quotes (targets name it)");
  if (!seen.insert(h.key).second) f.fail("key", "duplicate key");
  h.name = f.required_string("name", "a name for reports, in double quotes");
  h.source = f.required_string("source", std::string(source_is));
  h.status = source_status(f);
  h.note = f.string("note").value_or("");
  return h;
}

Sourced sourced(const Fields& f, std::string_view key, double scale) {
  const toml::node* n = f.node(key);
  if (n == nullptr) f.missing(key, std::string(kSourcedForm));
  if (!n->is_table()) f.fail(key, "must be " + std::string(kSourcedForm));
  const Fields q = f.nested(key, *n->as_table(), {plain("value"), plain("source"), plain("status"), plain("note")});
  Sourced s;
  s.value = q.required_number("value", "a number") * scale;
  s.source = q.required_string("source", "the publication or code the value is taken from");
  if (s.source.empty()) q.fail("source", "must name a source");
  s.status = source_status(q);
  s.note = q.string("note").value_or("");
  return s;
}

}  // namespace coldcore::io::detail
