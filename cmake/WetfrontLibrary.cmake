# wetfront_library(NAME SOURCES <files> [PUBLIC <targets>] [PRIVATE <targets>])
# One library per folder: target wetfront_NAME, alias and exported name wetfront::NAME, public
# headers in NAME/include (installed), private headers in NAME/src, every warning on.
include(GNUInstallDirs)

function(wetfront_library name)
  cmake_parse_arguments(ARG "" "" "SOURCES;PUBLIC;PRIVATE" ${ARGN})
  set(target wetfront_${name})
  add_library(${target} ${ARG_SOURCES})
  add_library(wetfront::${name} ALIAS ${target})
  set_target_properties(${target} PROPERTIES EXPORT_NAME ${name})
  target_include_directories(${target}
    PUBLIC $<BUILD_INTERFACE:${CMAKE_CURRENT_SOURCE_DIR}/include> $<INSTALL_INTERFACE:${CMAKE_INSTALL_INCLUDEDIR}>
    PRIVATE ${CMAKE_CURRENT_SOURCE_DIR}/src)
  target_link_libraries(${target} PUBLIC ${ARG_PUBLIC} PRIVATE ${ARG_PRIVATE} $<BUILD_INTERFACE:wetfront_warnings>)
  install(TARGETS ${target} EXPORT wetfrontTargets
          ARCHIVE DESTINATION ${CMAKE_INSTALL_LIBDIR} LIBRARY DESTINATION ${CMAKE_INSTALL_LIBDIR})
  install(DIRECTORY ${CMAKE_CURRENT_SOURCE_DIR}/include/ DESTINATION ${CMAKE_INSTALL_INCLUDEDIR})
endfunction()
