// Fixture for the core/layers_catches_upward test.
#pragma once
