#include "gui/audio.hpp"

#include <algorithm>
#include <cmath>

#include <SFML/Audio/Sound.hpp>
#include <SFML/Audio/SoundBuffer.hpp>

namespace terzo::gui {

Player::Player() = default;
Player::~Player() {
    if (sound_) sound_->stop();
}

std::string Player::play(const std::vector<double>& samples, int sample_rate, double volume) {
    stop();
    std::vector<sf::Int16> pcm(samples.size());
    std::transform(samples.begin(), samples.end(), pcm.begin(), [](double x) {
        return static_cast<sf::Int16>(std::lround(std::clamp(x, -1.0, 1.0) * 32767.0));
    });
    buffer_ = std::make_unique<sf::SoundBuffer>();
    // With no sound device SFML 2.5 still "loads" the buffer but reports a wrong rate and
    // channel count: that is how a missing device shows.
    if (!buffer_->loadFromSamples(pcm.data(), pcm.size(), 1, static_cast<unsigned>(sample_rate)) ||
        buffer_->getSampleRate() != static_cast<unsigned>(sample_rate) || buffer_->getChannelCount() != 1) {
        buffer_.reset();
        return "no audio output device was found, so nothing can be played here "
               "(terzo render writes the same sound to a WAV file)";
    }
    sound_ = std::make_unique<sf::Sound>(*buffer_);
    set_volume(volume);
    sound_->play();
    return {};
}

void Player::stop() {
    if (sound_) sound_->stop();
}

bool Player::playing() const { return sound_ && sound_->getStatus() == sf::Sound::Playing; }

void Player::set_volume(double volume) {
    if (sound_) sound_->setVolume(static_cast<float>(std::clamp(volume, 0.0, 1.0) * 100.0));
}

} // namespace terzo::gui
