// Fixture for the core/layers_catches_upward test: an analysis header reaching up into io.
#pragma once

#include "core/io/upward.hpp"
