# Installation extras and the Debian package (owned by the demo/onboarding work).
# `cmake --install build` puts the binary (top CMakeLists), the docs and the demo in the usual
# places; `cpack --config build/CPackConfig.cmake` builds treegate_<version>_<arch>.deb whose
# Depends are computed by dpkg-shlibdeps from the libraries the binary actually links against.
include(GNUInstallDirs)

file(GLOB treegate_docs CONFIGURE_DEPENDS ${CMAKE_SOURCE_DIR}/docs/*.md)
if(treegate_docs)
  install(FILES ${treegate_docs} DESTINATION ${CMAKE_INSTALL_DOCDIR})
endif()
# The demo (suites, grammars, treebank, config) so that the --help examples run after install.
install(DIRECTORY ${CMAKE_SOURCE_DIR}/suites/demo ${CMAKE_SOURCE_DIR}/suites/examples
        DESTINATION ${CMAKE_INSTALL_DATADIR}/treegate/suites)
install(DIRECTORY ${CMAKE_SOURCE_DIR}/ci/recipes DESTINATION ${CMAKE_INSTALL_DOCDIR}/examples
        USE_SOURCE_PERMISSIONS OPTIONAL)

set(CPACK_GENERATOR DEB)
set(CPACK_PACKAGE_NAME treegate)
set(CPACK_PACKAGE_VERSION ${PROJECT_VERSION})
set(CPACK_PACKAGE_VENDOR "The treegate authors")
set(CPACK_PACKAGE_CONTACT "The treegate authors <treegate@localhost>")
set(CPACK_PACKAGE_DESCRIPTION_SUMMARY "regression-test harness for probabilistic context-free grammars")
set(CPACK_DEBIAN_PACKAGE_DESCRIPTION
    "regression-test harness for probabilistic context-free grammars
 treegate parses curated suites of gold trees with a grammar (its own CKY/Viterbi
 parser or an external command), scores them with labeled PARSEVAL, compares the
 run with a baseline run and gates CI with JUnit XML and HTML reports.")
set(CPACK_RESOURCE_FILE_LICENSE ${CMAKE_SOURCE_DIR}/LICENSE)
set(CPACK_PACKAGING_INSTALL_PREFIX /usr)
set(CPACK_DEBIAN_FILE_NAME DEB-DEFAULT)
set(CPACK_DEBIAN_PACKAGE_SECTION devel)
set(CPACK_DEBIAN_PACKAGE_PRIORITY optional)
# Depends: one entry per shared library of the binary, via dpkg-shlibdeps (package dpkg-dev).
set(CPACK_DEBIAN_PACKAGE_SHLIBDEPS ON)
set(CPACK_STRIP_FILES ON)
set(CPACK_DEBIAN_COMPRESSION_TYPE gzip)
include(CPack)
