# Command-line checks: the built binary run as a user would. Each case names what it checks.
# cli_case(NAME EXPECT_EXIT ARGS...) runs coldcore and passes when its exit code matches.
function(cli_case name expect_exit)
  add_test(NAME cli.${name}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DEXPECT=${expect_exit}
                   "-DARGS=${ARGN}" -P ${PROJECT_SOURCE_DIR}/tests/cli/expect_exit.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endfunction()

cli_case(version 0 --version)
cli_case(help 0 --help)
cli_case(unknown_verb 2 frobnicate)
