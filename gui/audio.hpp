// Playing rendered samples through SFML audio. The samples come from core/sound (render);
// this only hands them to the sound device, and says so plainly when there is none.
#pragma once

#include <memory>
#include <string>
#include <vector>

namespace sf {
class SoundBuffer;
class Sound;
} // namespace sf

namespace terzo::gui {

class Player {
public:
    Player();
    ~Player();
    /// Plays mono samples in [-1, 1] at sample_rate with volume 0..1; returns an error
    /// message (no device, or the device refused the buffer), or "" when playing.
    std::string play(const std::vector<double>& samples, int sample_rate, double volume);
    void stop();
    bool playing() const;
    void set_volume(double volume);

private:
    std::unique_ptr<sf::SoundBuffer> buffer_;
    std::unique_ptr<sf::Sound> sound_;
};

} // namespace terzo::gui
