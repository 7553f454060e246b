#include "cli/log_options.hpp"

#include "coldcore/error.hpp"

namespace coldcore::cli {

void add_log_format_options(CLI::App& sub, LogFormatArgs& a, const std::string& time_option) {
  if (!time_option.empty())
    sub.add_option(time_option, a.time_column,
                   "the log's time column by its header name (default: the first named time_s, time_min, time_h "
                   "or timestamp; a column named otherwise holds ISO-8601 timestamps)");
  sub.add_option("--delimiter", a.delimiter,
                 "cell separator of the logs: , or ; or tab (default: ; or tab when the header has it and no comma "
                 "outside quotes, else ,)");
  sub.add_flag("--decimal-comma", a.decimal_comma,
               "read 12,5 as 12.5 in the logs (the default when the separator is ; or tab)");
}

void apply_log_format(const LogFormatArgs& a, io::LogOptions& lo) {
  lo.time_column = a.time_column;
  if (a.delimiter == "," || a.delimiter == ";") {
    lo.delimiter = a.delimiter[0];
  } else if (a.delimiter == "tab" || a.delimiter == "\t" || a.delimiter == "\\t") {
    lo.delimiter = '\t';
  } else if (!a.delimiter.empty()) {
    throw InputError("--delimiter = \"" + a.delimiter + "\": must be , or ; or tab");
  }
  if (a.decimal_comma) {
    if (lo.delimiter == ',') throw InputError("--decimal-comma: needs a separator other than , (--delimiter ; or tab)");
    lo.decimal_comma = true;
  }
}

}  // namespace coldcore::cli
