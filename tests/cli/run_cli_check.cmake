# Runs the wetfront program once and checks its exit code and output.
#   cmake -DPROGRAM=<path> -DARGS=<args separated by |> -DEXPECT_EXIT=<code>
#         -DEXPECT_REGEX=<regex searched in stdout+stderr> [-DWORKDIR=<dir>] -P run_cli_check.cmake
string(REPLACE "|" ";" arguments "${ARGS}")
if(NOT WORKDIR)
  set(WORKDIR ".")
endif()
execute_process(COMMAND "${PROGRAM}" ${arguments}
                WORKING_DIRECTORY "${WORKDIR}"
                RESULT_VARIABLE exit_code OUTPUT_VARIABLE out ERROR_VARIABLE err)
set(all "${out}${err}")
if(NOT "${exit_code}" STREQUAL "${EXPECT_EXIT}")
  message(FATAL_ERROR "exit code ${exit_code}, expected ${EXPECT_EXIT}\n--- output ---\n${all}")
endif()
if(NOT all MATCHES "${EXPECT_REGEX}")
  message(FATAL_ERROR "output does not match '${EXPECT_REGEX}'\n--- output ---\n${all}")
endif()
