# issue 12: the layer order of /work/shared/DESIGN.md ("Layer order"), written once here and
# checked on every #include "..." under src/ and include/coldcore/. An area includes only areas
# below it; areas of the same rank do not include each other. Run by ctest:
#   cmake -DSRC=<source tree> -P tests/layers/check_layers.cmake
# It fails on an include that breaks the order (a cycle between areas needs one), and on an
# entry of the known-exceptions list below that no longer occurs (so the list only shrinks).

# Rank of each area; the top-level headers (coldcore/error.hpp, suggest.hpp, version.hpp) are the
# base every area may use, beside model.
set(rank_base 1)
set(rank_model 1)
set(rank_properties 2)
set(rank_conduction 3)
set(rank_lethality 3)
set(rank_process 4)
set(rank_io 4)
set(rank_report 5)
set(rank_cli 6)

# Known exceptions, to be removed by issue 12 (io still builds process::Scenario). "file -> include".
set(allowed
  "include/coldcore/io/scenario.hpp -> coldcore/process/conservative.hpp"
  "include/coldcore/io/scenario.hpp -> coldcore/process/inverse.hpp")

function(area_of_file path out)
  if(path MATCHES "^(src|include/coldcore)/([a-z_]+)/")
    set(${out} "${CMAKE_MATCH_2}" PARENT_SCOPE)
  else()
    set(${out} base PARENT_SCOPE)
  endif()
endfunction()

file(GLOB_RECURSE files RELATIVE ${SRC} ${SRC}/src/*.cpp ${SRC}/src/*.hpp ${SRC}/include/coldcore/*.hpp
     ${SRC}/include/coldcore/*.hpp.in)
set(violations "")
set(seen "")
set(edges "")
foreach(f IN LISTS files)
  area_of_file("${f}" a)
  if(NOT DEFINED rank_${a})
    list(APPEND violations "${f}: area '${a}' has no rank in tests/layers/check_layers.cmake")
    continue()
  endif()
  file(STRINGS ${SRC}/${f} lines REGEX "^#include \"")
  foreach(line IN LISTS lines)
    string(REGEX REPLACE "^#include \"([^\"]+)\".*" "\\1" inc "${line}")
    if(inc MATCHES "^coldcore/([a-z_]+)/")
      set(b "${CMAKE_MATCH_1}")
    elseif(inc MATCHES "^coldcore/")
      set(b base)
    elseif(inc MATCHES "^([a-z_]+)/")
      set(b "${CMAKE_MATCH_1}")
    else()
      set(b "${a}")  # beside the file: the same area
    endif()
    if(NOT DEFINED rank_${b})
      continue()  # not one of coldcore's areas (a library's header)
    endif()
    if(b STREQUAL a)
      continue()
    endif()
    list(APPEND edges "${a} -> ${b}")
    set(ok TRUE)
    if(rank_${b} GREATER rank_${a})
      set(ok FALSE)
    elseif(rank_${b} EQUAL rank_${a} AND NOT rank_${a} EQUAL 1)
      set(ok FALSE)  # siblings (conduction/lethality, process/io) stay apart
    endif()
    if(NOT ok)
      set(entry "${f} -> ${inc}")
      list(FIND allowed "${entry}" known)
      if(known EQUAL -1)
        list(APPEND violations "${entry} (${a} may not include ${b})")
      else()
        list(APPEND seen "${entry}")
      endif()
    endif()
  endforeach()
endforeach()

# The graph between areas, for the log (and the issue's before/after note).
list(SORT edges)
set(graph "")
set(prev "")
set(count 0)
foreach(e IN LISTS edges ITEMS "")
  if(NOT e STREQUAL prev AND NOT prev STREQUAL "")
    string(APPEND graph "  ${prev} (${count})\n")
    set(count 0)
  endif()
  set(prev "${e}")
  math(EXPR count "${count} + 1")
endforeach()
message(STATUS "include graph between areas (edge, number of includes):\n${graph}")

foreach(entry IN LISTS allowed)
  list(FIND seen "${entry}" used)
  if(used EQUAL -1)
    list(APPEND violations "no longer occurs, remove it from the exceptions: ${entry}")
  endif()
endforeach()
list(LENGTH allowed n_allowed)
if(violations)
  string(REPLACE ";" "\n  " text "${violations}")
  message(FATAL_ERROR "layer order broken:\n  ${text}")
endif()
message(STATUS "layer order kept (${n_allowed} known exceptions left to remove)")
