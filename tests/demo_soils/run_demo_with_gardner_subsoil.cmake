# Copies the demo site, replaces the loam subsoil's van Genuchten parameters with a Gardner
# model of the same water contents and conductivity, runs the season and expects it to finish.
#   cmake -DPROGRAM=... -DDEMO_DIR=... -DWORK_DIR=... -DSORPTIVE=<1/cm> -P run_demo_with_gardner_subsoil.cmake
file(REMOVE_RECURSE "${WORK_DIR}")
file(COPY "${DEMO_DIR}/" DESTINATION "${WORK_DIR}")
file(READ "${WORK_DIR}/site.toml" site)
string(REGEX REPLACE "model = \"van Genuchten-Mualem\"[^[]*saturated_conductivity = \"20 cm/d\"\npore_connectivity = 0.5"
       "model = \"Gardner\"\nresidual_water_content = 0.08\nsaturated_water_content = \"0.42 cm3/cm3\"\nsorptive_number = \"${SORPTIVE} 1/cm\"\nsaturated_conductivity = \"20 cm/d\""
       gardner_site "${site}")
if(gardner_site STREQUAL site)
  message(FATAL_ERROR "the demo's loam subsoil block was not found; update this test with the demo")
endif()
# The demo's parameter study (the last tables of the file) adjusts van Genuchten parameters of
# this layer; leave it out.
string(FIND "${gardner_site}" "\n[[adjustable]]" study_start)
if(study_start GREATER -1)
  string(SUBSTRING "${gardner_site}" 0 ${study_start} gardner_site)
endif()
file(WRITE "${WORK_DIR}/site.toml" "${gardner_site}")
execute_process(COMMAND "${PROGRAM}" run site.toml --quiet --out gardner.h5
                WORKING_DIRECTORY "${WORK_DIR}" RESULT_VARIABLE exit_code OUTPUT_VARIABLE out ERROR_VARIABLE err)
if(NOT exit_code EQUAL 0)
  message(FATAL_ERROR "wetfront run exited ${exit_code} with sorptive number ${SORPTIVE} 1/cm\n${out}${err}")
endif()
