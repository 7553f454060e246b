# Every doctest case must be selectable by the name CTest gives it. doctest_discover_tests runs
# each case as --test-case=<name>: doctest splits that filter at commas and CMake splits a list
# at semicolons, so a case whose name holds either runs under a filter that matches no case,
# and passes without running anything. (Found 2026-12-05: 122 of 311 cases had been passing
# that way under CTest; they all pass when run.) This check fails on such a name.
# usage: cmake -DBIN=<coldcore_tests> -P case_names.cmake
execute_process(COMMAND ${BIN} --list-test-cases --no-intro OUTPUT_VARIABLE listing RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "${BIN} --list-test-cases failed (${rc})")
endif()
string(REPLACE ";" "<semicolon>" listing "${listing}")
string(REPLACE "\n" ";" lines "${listing}")
set(bad "")
set(count 0)
foreach(line IN LISTS lines)
  if(line MATCHES "^\\[doctest\\]" OR line MATCHES "^=+$" OR line STREQUAL "")
    continue()
  endif()
  math(EXPR count "${count} + 1")
  if(line MATCHES "," OR line MATCHES "<semicolon>")
    string(APPEND bad "\n  ${line}")
  endif()
endforeach()
if(count LESS 100)
  message(FATAL_ERROR "only ${count} test cases listed by ${BIN}: the listing was not read")
endif()
if(bad)
  message(FATAL_ERROR "test case names with ',' or ';' (CTest would run them under a filter that "
                      "selects nothing; use ' / ' or ' - '):${bad}")
endif()
message(STATUS "${count} test case names, each selectable by CTest")
