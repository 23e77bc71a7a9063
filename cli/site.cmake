# The site-file loader and the season commands (`wetfront run`, `check`, `show`).
# wetfront_site turns a site file and its field records into the plain structs the libraries
# take; it has no command-line code, so tests link it directly. It also holds the unit parser
# and the input-error type and CSV reader (quantity.cpp, input_error.cpp, csv_table.cpp) that
# the soil commands use.
add_library(wetfront_site STATIC
  src/site_keys.cpp
  src/site_file.cpp
  src/season_setup.cpp
  src/sensor_readings.cpp
  src/sensor_check.cpp
  src/well_core_readings.cpp
  src/water_table_check.cpp
  src/field_check_record.cpp
  src/csv_table.cpp
  src/quantity.cpp
  src/input_error.cpp
  src/adjustable_parameters.cpp
  src/parameter_runs.cpp
  src/parameter_study.cpp
  src/study_output.cpp
  src/simulated_profiles.cpp)
target_include_directories(wetfront_site PUBLIC src)
target_link_libraries(wetfront_site
  PUBLIC wetfront_soils wetfront_forcing wetfront_solver wetfront_profiles wetfront_observations tomlplusplus::tomlplusplus fmt::fmt
  PRIVATE wetfront_warnings)

target_sources(wetfront PRIVATE src/season_commands.cpp src/season_report.cpp src/parameter_commands.cpp src/parameter_report.cpp src/sensor_report.cpp)
target_link_libraries(wetfront PRIVATE wetfront_site wetfront_forcing wetfront_solver wetfront_profiles Threads::Threads)
