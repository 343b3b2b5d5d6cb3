// The analysis tests' scales now live in tests/support/scales.hpp, shared by every layer.
#pragma once

#include "tests/support/scales.hpp"
