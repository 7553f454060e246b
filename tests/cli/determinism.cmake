# issue 18: the same input gives the same bytes whatever the working folder and the time zone.
# Every verb × format it writes runs twice, from two different working folders and with two
# different TZ values, with absolute paths and a fixed --date; every file written (the report and
# the plots beside a Markdown report) must match byte for byte.
# Run by ctest with -DEXE, -DSRC (source tree), -DWORK (scratch folder).
set(w ${WORK}/determinism)
file(REMOVE_RECURSE ${w})
set(P ${SRC}/products)
# verb|arguments separated by ^|formats separated by ^
set(cases
  "run|${P}/kofta-balls.toml|text^md^html^json^csv"
  "probe|${P}/logs/kofta-probe.csv^--organism^listeria-monocytogenes^--rule^two-stage-6h|text^md^html^json^csv"
  "solve|${P}/kofta-balls.toml^--for^hold-time|text^md^html^json^csv"
  "deviation|${P}/kofta-balls.toml^--medium-log^${P}/logs/kofta-oven-deviation.csv|text^md^html^json^csv"
  "modes|--shape^sphere^--biot^5|text^json^csv"
  "props|--composition^water=0.74,protein=0.22,fat=0.03,ash=0.01|text^json^csv"
  "organisms|--units^C|text^json^csv"
  "rules|--units^C|text^json^csv"
  "media|--library^${P}|text^json^csv")
set(n 0)
foreach(c IN LISTS cases)
  string(REPLACE "|" ";" parts "${c}")
  list(GET parts 0 verb)
  list(GET parts 1 args)
  list(GET parts 2 formats)
  string(REPLACE "^" ";" argv "${args}")
  string(REPLACE "^" ";" formats "${formats}")
  foreach(fmt IN LISTS formats)
    math(EXPR n "${n} + 1")
    set(dated "")
    if(verb MATCHES "^(run|probe|solve|deviation)$")
      set(dated --date 2026-12-01)
    endif()
    foreach(side a b)
      if(side STREQUAL "a")
        set(tz UTC)
      else()
        set(tz Pacific/Auckland)
      endif()
      file(MAKE_DIRECTORY ${w}/${n}/${side}/cwd ${w}/${n}/${side}/out)
      execute_process(COMMAND ${CMAKE_COMMAND} -E env TZ=${tz} ${EXE} ${verb} ${argv} --format ${fmt} ${dated}
                              --out ${w}/${n}/${side}/out/report.${fmt}
                      WORKING_DIRECTORY ${w}/${n}/${side}/cwd RESULT_VARIABLE rc ERROR_VARIABLE err OUTPUT_QUIET)
      if(rc GREATER 1)
        message(FATAL_ERROR "${verb} ${fmt} (${side}): exit ${rc}: ${err}")
      endif()
    endforeach()
    file(GLOB fa RELATIVE ${w}/${n}/a/out ${w}/${n}/a/out/*)
    file(GLOB fb RELATIVE ${w}/${n}/b/out ${w}/${n}/b/out/*)
    if(NOT fa STREQUAL fb OR fa STREQUAL "")
      message(FATAL_ERROR "${verb} ${fmt}: wrote [${fa}] and [${fb}]")
    endif()
    foreach(f IN LISTS fa)
      file(SHA256 ${w}/${n}/a/out/${f} ha)
      file(SHA256 ${w}/${n}/b/out/${f} hb)
      if(NOT ha STREQUAL hb)
        message(FATAL_ERROR "${verb} ${fmt}: ${f} differs between working folders / time zones")
      endif()
    endforeach()
  endforeach()
endforeach()
message(STATUS "${n} verb × format cases gave the same bytes")
file(REMOVE_RECURSE ${w})
