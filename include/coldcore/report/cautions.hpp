#pragma once
/// The safety cautions every report prints, in every format.
#include <iosfwd>
#include <string>
#include <vector>

namespace coldcore {

/// The cautions, one sentence each, in the order reports print them.
const std::vector<std::string>& cautions();

/// The cautions of a report about measured data (probe): the same duties (heat-penetration and
/// temperature-distribution studies, process authority, regulator, local codes) with the
/// measurement's assumptions in place of the model's.
const std::vector<std::string>& measured_cautions();

/// The sign-off every record carries, in every human format (issue 16): blank lines filled in by
/// hand. The tool decides nothing; the people named here do.
const std::vector<std::string>& sign_off_labels();
/// The sentence above the sign-off lines.
const char* sign_off_note();
/// The sign-off as plain text: a "SIGN-OFF" heading, the note and one line per label.
void write_sign_off_text(std::ostream& out);

}  // namespace coldcore
