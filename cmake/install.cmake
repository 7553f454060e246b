# Installation and the CMake package: `cmake --install build --prefix P` puts
#   P/bin/coldcore, P/lib/libcoldcore_core.a, P/include/coldcore/...,
#   P/share/coldcore/*.toml (the data libraries the executable finds relative to itself),
#   P/lib/cmake/coldcore/ (coldcoreConfig.cmake: find_package(coldcore) gives coldcore::core).
include(CMakePackageConfigHelpers)

set(COLDCORE_CMAKE_DIR ${CMAKE_INSTALL_LIBDIR}/cmake/coldcore)

install(TARGETS coldcore_core EXPORT coldcoreTargets
        ARCHIVE DESTINATION ${CMAKE_INSTALL_LIBDIR}
        INCLUDES DESTINATION ${CMAKE_INSTALL_INCLUDEDIR})
install(TARGETS coldcore RUNTIME DESTINATION ${CMAKE_INSTALL_BINDIR})
install(DIRECTORY ${PROJECT_SOURCE_DIR}/include/coldcore DESTINATION ${CMAKE_INSTALL_INCLUDEDIR}
        FILES_MATCHING PATTERN "*.hpp")
install(FILES ${CMAKE_BINARY_DIR}/generated/coldcore/version.hpp
        DESTINATION ${CMAKE_INSTALL_INCLUDEDIR}/coldcore)
# The data libraries, each value with its source; demo products are not installed.
install(FILES ${PROJECT_SOURCE_DIR}/products/organisms.toml ${PROJECT_SOURCE_DIR}/products/cooling-rules.toml
              ${PROJECT_SOURCE_DIR}/products/cooking-tables.toml ${PROJECT_SOURCE_DIR}/products/media.toml
        DESTINATION ${CMAKE_INSTALL_DATADIR}/coldcore)

install(EXPORT coldcoreTargets NAMESPACE coldcore:: DESTINATION ${COLDCORE_CMAKE_DIR})
configure_package_config_file(${PROJECT_SOURCE_DIR}/cmake/coldcoreConfig.cmake.in
                              ${CMAKE_BINARY_DIR}/coldcoreConfig.cmake
                              INSTALL_DESTINATION ${COLDCORE_CMAKE_DIR})
write_basic_package_version_file(${CMAKE_BINARY_DIR}/coldcoreConfigVersion.cmake
                                 COMPATIBILITY SameMinorVersion)
install(FILES ${CMAKE_BINARY_DIR}/coldcoreConfig.cmake ${CMAKE_BINARY_DIR}/coldcoreConfigVersion.cmake
        DESTINATION ${COLDCORE_CMAKE_DIR})
