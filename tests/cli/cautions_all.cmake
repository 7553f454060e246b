# Walks every reporting verb in every format it accepts and checks the cautions are printed:
# engineering estimates, heat-penetration / temperature-distribution studies, the process
# authority and the regulator, local codes. Markdown goes to a file (its plots beside it).
set(phrases "engineering estimates" "heat-penetration" "temperature-distribution" "process authority" "regulator" "local food codes")
set(scratch ${WORK}/cautions-check)
file(REMOVE_RECURSE ${scratch})
file(MAKE_DIRECTORY ${scratch})
set(cases
  "run|products/kofta-balls.toml|text,md,html,json,csv"
  "probe|products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 --rule two-stage-6h|text,md,html,json,csv"
  "modes|--shape sphere --biot 2|text,json,csv"
  "props|--composition water=0.74,protein=0.22,fat=0.03,ash=0.01|text,json,csv"
  "organisms|-|text,json,csv"
  "rules|-|text,json,csv"
  "fit|tests/cli/fit/sphere-study.toml --probe-log tests/reference/heat_penetration/sphere_noisy.csv --probe-column centre_C --library products|text,md,html,json,csv")
foreach(extra IN LISTS EXTRA_CASES)
  list(APPEND cases "${extra}")
endforeach()
foreach(c IN LISTS cases)
  string(REPLACE "|" ";" parts "${c}")
  list(GET parts 0 verb)
  list(GET parts 1 argstr)
  list(GET parts 2 fmts)
  if(argstr STREQUAL "-")
    set(args "")
  else()
    separate_arguments(args UNIX_COMMAND "${argstr}")
  endif()
  string(REPLACE "," ";" fmts "${fmts}")
  foreach(fmt IN LISTS fmts)
    if(fmt STREQUAL "md")
      set(outfile ${scratch}/${verb}.md)
      execute_process(COMMAND ${EXE} ${verb} ${args} --format md --out ${outfile}
                      WORKING_DIRECTORY ${SRC} RESULT_VARIABLE rc ERROR_VARIABLE err)
      file(READ ${outfile} out)
    else()
      execute_process(COMMAND ${EXE} ${verb} ${args} --format ${fmt}
                      WORKING_DIRECTORY ${SRC} RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
    endif()
    if(rc GREATER 1)
      message(FATAL_ERROR "${verb} --format ${fmt}: exit ${rc}: ${err}")
    endif()
    foreach(p IN LISTS phrases)
      string(FIND "${out}" "${p}" pos)
      if(pos EQUAL -1)
        message(FATAL_ERROR "${verb} --format ${fmt}: the cautions lack '${p}'")
      endif()
    endforeach()
    # Every record a person signs (the verbs with a verdict or a study, in the formats read by
    # people) carries the sign-off lines (issue 16): prepared, reviewed, date, decision, action.
    if(NOT verb MATCHES "^(modes|props|organisms|rules|media)$" AND fmt MATCHES "^(text|md|html)$")
      foreach(p "Prepared by" "Reviewed by" "Decision (accept / hold / reprocess / reject)" "Corrective action")
        string(FIND "${out}" "${p}" pos)
        if(pos EQUAL -1)
          message(FATAL_ERROR "${verb} --format ${fmt}: the sign-off lacks '${p}'")
        endif()
      endforeach()
    endif()
    # temperatures in free text are tokens until shown (report/temperature_text.hpp): none may
    # reach a report unrendered. The quoted character is U+E000, the first code point of a token.
    string(FIND "${out}" "" leaked)
    if(NOT leaked EQUAL -1)
      message(FATAL_ERROR "${verb} --format ${fmt}: an unrendered temperature token in the output")
    endif()
  endforeach()
endforeach()
