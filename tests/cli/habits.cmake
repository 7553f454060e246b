# issue 16: command-line habits of well-kept tools (POSIX utility conventions, common practice):
# -o/-f short options, the format named by the --out extension, "-" for standard input and
# output, `coldcore help VERB`, "did you mean" for options, --library on every verb that reads a
# data library. Run by ctest with -DEXE, -DSRC (source tree), -DWORK (scratch folder).
set(w ${WORK}/habits)
file(REMOVE_RECURSE ${w})
file(MAKE_DIRECTORY ${w}/lib)
file(COPY ${SRC}/products/kofta-balls.toml DESTINATION ${w})
file(COPY ${SRC}/products/organisms.toml ${SRC}/products/cooling-rules.toml ${SRC}/products/cooking-tables.toml
          ${SRC}/products/media.toml DESTINATION ${w}/lib)

include(${CMAKE_CURRENT_LIST_DIR}/run_helpers.cmake)

function(must_begin case file prefix)
  file(READ ${w}/${file} content LIMIT 40)
  string(FIND "${content}" "${prefix}" at)
  if(NOT at EQUAL 0)
    message(FATAL_ERROR "${case}: ${file} does not begin with \"${prefix}\": ${content}")
  endif()
endfunction()

# The extension names the format; -o is --out.
run_ok(json_by_extension 0 run kofta-balls.toml -o k.json --date 2026-12-01)
must_begin(json_by_extension k.json "{")
must_have(json_by_extension "${err}" "report written to k.json")
run_ok(html_by_extension 0 run kofta-balls.toml -o k.HTM --date 2026-12-01)
must_begin(html_by_extension k.HTM "<!DOCTYPE html>")
run_ok(csv_by_extension 0 organisms -o o.csv)
file(READ ${w}/o.csv csv)
must_have(csv_by_extension "${csv}" "caution:")
must_begin(csv_by_extension o.csv "key,quantity,value,status,source,notes")
# An explicit -f wins over the extension; an unknown extension means text.
run_ok(explicit_format 0 run kofta-balls.toml -f text -o k2.json --date 2026-12-01)
must_begin(explicit_format k2.json "coldcore run")
run_ok(unknown_extension 0 run kofta-balls.toml -o k.report --date 2026-12-01)
must_begin(unknown_extension k.report "coldcore run")
# An extension naming a format the verb does not write is refused, and nothing is written.
run_ok(extension_not_written 2 organisms -o o.html)
must_have(extension_not_written "${err}" "--out = o.html: its extension names format html, which this verb does not write")
if(EXISTS ${w}/o.html)
  message(FATAL_ERROR "extension_not_written: o.html was written")
endif()

# "-": standard output for -o (no file named "-"), standard input for the product file.
run_ok(out_dash 0 run kofta-balls.toml -o - -f json --date 2026-12-01)
must_have(out_dash "${out}" "\"verb\": \"run\"")
if(EXISTS ${w}/-)
  message(FATAL_ERROR "out_dash: a file named '-' was written")
endif()
run_ok(stdin_product 0 INPUT ${w}/kofta-balls.toml run - -f json --library lib --date 2026-12-01)
must_have(stdin_product "${out}" "\"verb\": \"run\"")
must_have(stdin_product "${out}" "All 2 targets met")
run_ok(md_to_stdout 2 run kofta-balls.toml -f md -o -)
must_have(md_to_stdout "${err}" "give --out PATH.md")

# help VERB, and the nearest option or verb.
run_ok(help_verb 0 help probe)
must_have(help_verb "${out}" "--temp-column")
must_have(help_verb "${out}" "--library")
run_ok(help_unknown 2 help prbe)
must_have(help_unknown "${err}" "help: unknown verb 'prbe'; did you mean 'probe'?")
run_ok(option_typo 2 run kofta-balls.toml --fromat html)
must_have(option_typo "${err}" "run: unknown option '--fromat'; did you mean '--format'? (coldcore help run)")
run_ok(option_typo_with_value 2 solve kofta-balls.toml --for=hold-time --stpe-s=30)
must_have(option_typo_with_value "${err}" "did you mean '--step-s'?")

# --library on the verbs that read a library, with the search order in --help.
run_ok(organisms_library 0 organisms --library lib -f json)
must_have(organisms_library "${out}" "lib/organisms.toml")
run_ok(rules_library_missing 2 rules --library nowhere)
must_have(rules_library_missing "${err}" "--library = nowhere: has no organisms.toml")
run_ok(help_search_order 0 --help)
must_have(help_search_order "${out}" "$COLDCORE_DATA_DIR")

# The default report date is the local date (POSIX TZ strings, no tz database needed): 14 h east
# and 12 h west of Greenwich are always on different calendar days.
foreach(tz XST-14 YST12)
  execute_process(COMMAND ${CMAKE_COMMAND} -E env TZ=${tz} ${EXE} run kofta-balls.toml -f json WORKING_DIRECTORY ${w}
                  OUTPUT_VARIABLE o RESULT_VARIABLE rc)
  string(REGEX MATCH "\"date\": \"([0-9-]+)\"" m "${o}")
  set(date_${tz} "${CMAKE_MATCH_1}")
endforeach()
if(date_XST-14 STREQUAL "" OR date_XST-14 STREQUAL date_YST12)
  message(FATAL_ERROR "local_date: east ${date_XST-14}, west ${date_YST12}: must be two different dates")
endif()
file(REMOVE_RECURSE ${w})
