#pragma once
// The [[stage]] and [[target]] parts of a product file, parsed into a ProductFile.
#include <filesystem>

#include "coldcore/io/product_file.hpp"
#include "io/detail/fields.hpp"

namespace coldcore::io::detail {

/// Fills out.stages (and out.warnings from medium logs). `root` is the document's Fields.
void parse_stages(const Fields& root, const std::filesystem::path& base_dir, const LogReader& read_log,
                  ProductFile& out);

/// Fills out.targets; REQUIRES: out.stages already parsed (targets name stages).
void parse_targets(const Fields& root, ProductFile& out);

}  // namespace coldcore::io::detail
