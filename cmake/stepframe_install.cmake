# `cmake --install`: the command, libstepframe.so (C++ API and C ABI), every
# public header, the section catalogues, the Python module, a CMake package
# (find_package(stepframe) -> stepframe::stepframe) and a pkg-config file.
include(GNUInstallDirs)
include(CMakePackageConfigHelpers)

set(STEPFRAME_INSTALL_CMAKEDIR ${CMAKE_INSTALL_LIBDIR}/cmake/stepframe)
set(STEPFRAME_INSTALL_DATADIR ${CMAKE_INSTALL_DATADIR}/stepframe)

install(TARGETS stepframe stepframe_engine RUNTIME DESTINATION ${CMAKE_INSTALL_BINDIR})  # the launcher and the program, side by side
install(TARGETS stepframe_shared EXPORT stepframeTargets
  LIBRARY DESTINATION ${CMAKE_INSTALL_LIBDIR}
  INCLUDES DESTINATION ${CMAKE_INSTALL_INCLUDEDIR})
foreach(stage geometry analysis viz plugin)
  install(DIRECTORY ${PROJECT_SOURCE_DIR}/${stage}/include/ DESTINATION ${CMAKE_INSTALL_INCLUDEDIR})
endforeach()
install(DIRECTORY ${PROJECT_SOURCE_DIR}/data/sections DESTINATION ${STEPFRAME_INSTALL_DATADIR})
install(DIRECTORY ${PROJECT_SOURCE_DIR}/plugin/examples/ DESTINATION ${STEPFRAME_INSTALL_DATADIR}/examples)
if(TARGET stepframe_python)
  install(TARGETS stepframe_python LIBRARY DESTINATION ${STEPFRAME_PYTHON_INSTALL_DIR})
endif()

install(EXPORT stepframeTargets NAMESPACE stepframe:: DESTINATION ${STEPFRAME_INSTALL_CMAKEDIR})
configure_package_config_file(${PROJECT_SOURCE_DIR}/cmake/stepframeConfig.cmake.in
  ${PROJECT_BINARY_DIR}/stepframeConfig.cmake
  INSTALL_DESTINATION ${STEPFRAME_INSTALL_CMAKEDIR}
  PATH_VARS STEPFRAME_INSTALL_DATADIR)
write_basic_package_version_file(${PROJECT_BINARY_DIR}/stepframeConfigVersion.cmake
  VERSION ${PROJECT_VERSION} COMPATIBILITY SameMinorVersion)
install(FILES ${PROJECT_BINARY_DIR}/stepframeConfig.cmake ${PROJECT_BINARY_DIR}/stepframeConfigVersion.cmake
  DESTINATION ${STEPFRAME_INSTALL_CMAKEDIR})

file(RELATIVE_PATH STEPFRAME_PC_PREFIX_REL /root/${CMAKE_INSTALL_LIBDIR}/pkgconfig /root)
configure_file(${PROJECT_SOURCE_DIR}/cmake/stepframe.pc.in ${PROJECT_BINARY_DIR}/stepframe.pc @ONLY)
install(FILES ${PROJECT_BINARY_DIR}/stepframe.pc DESTINATION ${CMAKE_INSTALL_LIBDIR}/pkgconfig)
