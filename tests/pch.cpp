// The object library that carries the tests' precompiled Catch2 header (see CMakeLists.txt).
