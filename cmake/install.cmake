# `cmake --install build` (with --prefix, or DESTDIR=... for a staging folder) puts in the
# usual places (GNUInstallDirs):
#   bin/terzo
#   share/terzo/scales/*.scl              the library of tunings
#   share/man/man1/terzo.1, terzo-SUBCOMMAND.1  generated from --help by help2man (when found)
# and with the GUI built:
#   bin/terzo-gui, share/man/man1/terzo-gui.1
#   share/terzo/assets/                   the window's font and demo tuning
#   share/applications/terzo-gui.desktop  the desktop entry
#   share/icons/hicolor/scalable/apps/terzo.svg  its icon (drawn for terzo)
# tests/install/install_check.sh installs into a scratch DESTDIR and checks each (ctest
# install/destdir). docs/install.md is the user's page.
include(GNUInstallDirs)

install(TARGETS terzo RUNTIME DESTINATION ${CMAKE_INSTALL_BINDIR})
install(DIRECTORY ${PROJECT_SOURCE_DIR}/scales/ DESTINATION ${CMAKE_INSTALL_DATADIR}/terzo/scales
        FILES_MATCHING PATTERN "*.scl")

# Man pages from each program's --help. help2man runs the built program, so this needs no
# display (terzo-gui prints its help before it looks for one).
find_program(HELP2MAN help2man)
set(TERZO_MAN_PAGES)
function(terzo_man_page target description)
  set(page ${PROJECT_BINARY_DIR}/man/${target}.1)
  add_custom_command(OUTPUT ${page}
    COMMAND ${CMAKE_COMMAND} -E make_directory ${PROJECT_BINARY_DIR}/man
    COMMAND ${HELP2MAN} --no-info --no-discard-stderr --section=1
            "--name=${description}" "--version-string=${PROJECT_VERSION}" ${ARGN}
            --output=${page} $<TARGET_FILE:${target}>
    DEPENDS ${target} ${TERZO_MAN_PAGES}
    COMMENT "Man page ${target}.1 from ${target} --help"
    VERBATIM)
  set(TERZO_MAN_PAGES ${TERZO_MAN_PAGES} ${page} PARENT_SCOPE)
endfunction()

if(HELP2MAN)
  # One page per subcommand (terzo-inspect.1, ...), then terzo.1 naming them under SEE ALSO.
  set(sub_stamp ${PROJECT_BINARY_DIR}/man/subcommands.stamp)
  add_custom_command(OUTPUT ${sub_stamp}
    COMMAND ${CMAKE_COMMAND} -DTERZO=$<TARGET_FILE:terzo> -DHELP2MAN=${HELP2MAN}
            -DOUT=${PROJECT_BINARY_DIR}/man -DVERSION=${PROJECT_VERSION}
            -P ${PROJECT_SOURCE_DIR}/cmake/man_pages.cmake
    COMMAND ${CMAKE_COMMAND} -E touch ${sub_stamp}
    DEPENDS terzo ${PROJECT_SOURCE_DIR}/cmake/man_pages.cmake
    COMMENT "Man pages of terzo's subcommands from their --help"
    VERBATIM)
  set(TERZO_MAN_PAGES ${sub_stamp})
  terzo_man_page(terzo "tunings and temperaments through their combination tones"
                 --include=${PROJECT_BINARY_DIR}/man/see-also.h2m)
else()
  message(STATUS "help2man not found: no man pages (Debian package help2man)")
endif()

if(TARGET terzo-gui)
  install(TARGETS terzo-gui RUNTIME DESTINATION ${CMAKE_INSTALL_BINDIR})
  install(FILES ${PROJECT_SOURCE_DIR}/assets/terzo-gui.desktop
          DESTINATION ${CMAKE_INSTALL_DATADIR}/applications)
  install(FILES ${PROJECT_SOURCE_DIR}/assets/icons/terzo.svg
          DESTINATION ${CMAKE_INSTALL_DATADIR}/icons/hicolor/scalable/apps)
  install(DIRECTORY ${PROJECT_SOURCE_DIR}/assets/fonts DESTINATION ${CMAKE_INSTALL_DATADIR}/terzo/assets)
  install(FILES ${PROJECT_SOURCE_DIR}/assets/demo.scl ${PROJECT_SOURCE_DIR}/assets/demo-session.json
          DESTINATION ${CMAKE_INSTALL_DATADIR}/terzo/assets)
  if(HELP2MAN)
    terzo_man_page(terzo-gui "the terzo window: tunings, their resultants, lattice, grid, keys and sheet")
  endif()
endif()

if(TERZO_MAN_PAGES)
  add_custom_target(man ALL DEPENDS ${TERZO_MAN_PAGES})
  install(DIRECTORY ${PROJECT_BINARY_DIR}/man/ DESTINATION ${CMAKE_INSTALL_MANDIR}/man1
          FILES_MATCHING PATTERN "*.1" PATTERN wrappers EXCLUDE)
endif()

if(BUILD_TESTING)
  add_test(NAME install/destdir
           COMMAND sh ${PROJECT_SOURCE_DIR}/tests/install/install_check.sh ${PROJECT_BINARY_DIR}
                   ${PROJECT_SOURCE_DIR} ${PROJECT_BINARY_DIR}/install-check
                   $<IF:$<TARGET_EXISTS:terzo-gui>,gui,nogui> $<IF:$<BOOL:${HELP2MAN}>,man,noman>)
  set_tests_properties(install/destdir PROPERTIES LABELS install)
endif()
