#!/usr/bin/env bash
# Install what Canalwright needs to build and test on Debian 12 (as root, or
# through sudo), and the de_DE.UTF-8 locale the locale test uses.
set -euo pipefail

packages=(
  build-essential meson ninja-build pkg-config gettext
  libglib2.0-dev libgtk-4-dev libjson-glib-dev libgsl-dev
  xvfb xauth xdotool imagemagick poppler-utils
  appstream desktop-file-utils valgrind clang locales python3
  libxml2-utils librsvg2-common libgtk-4-bin shared-mime-info libglib2.0-bin
)

sudo=""
if [ "$(id -u)" -ne 0 ]; then
  sudo="sudo"
fi

missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -gt 0 ]; then
  $sudo apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}"
fi

if ! locale -a 2>/dev/null | grep -qi '^de_DE\.utf-\?8$'; then
  $sudo sed -i 's/^# *de_DE.UTF-8 UTF-8/de_DE.UTF-8 UTF-8/' /etc/locale.gen
  grep -q '^de_DE.UTF-8 UTF-8' /etc/locale.gen || echo 'de_DE.UTF-8 UTF-8' | $sudo tee -a /etc/locale.gen >/dev/null
  $sudo locale-gen >/dev/null
fi
