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

# coldcore modes (foundation issue)
function(cli_expect name expect_exit)
  cmake_parse_arguments(C "" "" "ARGS;STDOUT_HAS;STDERR_HAS" ${ARGN})
  add_test(NAME cli.${name}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DEXPECT=${expect_exit}
                   "-DARGS=${C_ARGS}" "-DSTDOUT_HAS=${C_STDOUT_HAS}" "-DSTDERR_HAS=${C_STDERR_HAS}"
                   -P ${PROJECT_SOURCE_DIR}/tests/cli/expect_exit.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endfunction()

# Sphere Bi = 1: zeta_1 = pi/2 exactly, C1 = 4/pi (REFERENCES 7 item 1, analytic).
cli_expect(modes_sphere_bi1_text 0 ARGS modes --shape sphere --biot 1 --count 3
           STDOUT_HAS "1.5707963267949" "1.27323954473516" "process authority")
cli_expect(modes_json_inf 0 ARGS modes --shape cylinder --biot inf --count 2 --format json
           STDOUT_HAS "\"shape\": \"cylinder\"" "\"biot\": \"inf\"" "\"zeta\": 2.404825557695773" "cautions")
cli_expect(modes_csv 0 ARGS modes --shape slab --biot 10 --format csv
           STDOUT_HAS "n,zeta,coefficient,mean_coefficient" "# caution:")
cli_expect(modes_bad_biot 2 ARGS modes --shape sphere --biot -3 STDERR_HAS "--biot = -3: must be >= 1e-6")
cli_expect(modes_bad_shape 2 ARGS modes --shape cube --biot 1 STDERR_HAS "--shape = cube: must be sphere, cylinder or slab")
cli_expect(modes_bad_count 2 ARGS modes --shape sphere --biot 1 --count 0 STDERR_HAS "--count = 0: must be from 1 to 2000")
cli_expect(modes_bad_format 2 ARGS modes --shape sphere --biot 1 --format html STDERR_HAS "--format = html: must be one of text|json|csv")
cli_expect(pending_verb 2 ARGS solve x.toml STDERR_HAS "not available yet")

# coldcore props: lean beef 74/22/3/1 at 20 °C -> k 0.517, rho 1056.3, cp 3609 J/kgK
# (REFERENCES 7 item 20, Choi & Okos 1986 evaluated independently).
cli_expect(props_lean_beef 0 ARGS props --composition water=0.74,protein=0.22,fat=0.03,ash=0.01 --from-C 20 --to-C 20 --format csv
           STDOUT_HAS "20,0.5169" "1056.2" "3609.3" "# caution:")
cli_expect(props_bad_sum 2 ARGS props --composition water=0.7 STDERR_HAS "composition sum = 0.7: must be 1 within 0.005")
cli_expect(props_bad_component 2 ARGS props --composition water=0.7,sugar=0.3 STDERR_HAS "--composition sugar: unknown component")
