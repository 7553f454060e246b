// The run report's verdict rows say "shortfall" for a target not met: the assessment's margin text
// is the unsigned amount, and a bare "2.82 log10" in a margin column would read as a margin.
#include <doctest/doctest.h>

#include "coldcore/report/run_builder.hpp"

using namespace coldcore;

TEST_CASE("a verdict row of a target not met shows its shortfall as a shortfall") {
  TargetResult t;
  t.name = "listeria";
  t.kind = TargetKind::log_reduction;
  t.required = 6;
  t.achieved = 3.18;
  t.margin = -2.82;
  t.margin_text = "2.82 log10";
  t.verdict = Verdict::not_demonstrated;
  const VerdictRow v = verdict_row(t);
  CHECK(v.margin == "shortfall 2.82 log10");
  CHECK_FALSE(v.met);
  t.margin = 2.82;
  t.verdict = Verdict::met;
  CHECK(verdict_row(t).margin == "2.82 log10");
}
