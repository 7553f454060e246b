#pragma once
/// The csv layout a spreadsheet or `pandas.read_csv` reads with its defaults (issue 16): the
/// header on the first line, one table, and every note (verdict summary, cautions, provenance,
/// verdicts, warnings) kept in the file, one per row, in a last column named `notes`. The
/// writers produce the commented layout (`# ` lines before the header, `--csv-comments`); this
/// turns it into the header-first one, so the two carry the same words and numbers.
#include <string>
#include <string_view>

namespace coldcore {

/// The header-first form of a commented csv: the first non-comment line is the header, gaining
/// a last column `notes`; comment lines (without their "# ") fill that column from the first
/// data row down, in order. When there are more notes than data rows, the extra notes go on rows
/// whose other cells are empty. A table without comment lines gains an empty `notes` column.
/// REQUIRES: one table (comment lines, then one header line, then data lines).
std::string header_first_csv(std::string_view commented);

}  // namespace coldcore
