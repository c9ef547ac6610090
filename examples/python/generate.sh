#!/usr/bin/env bash
# Generates the Python stubs of protos/sibyl/v1/emulator.proto into OUT (default: ./generated) with protoc and the
# gRPC Python plugin, e.g. Debian's protobuf-compiler and protobuf-compiler-grpc, or `python3 -m grpc_tools.protoc`
# from a recent grpcio-tools (set PROTOC="python3 -m grpc_tools.protoc" and leave GRPC_PLUGIN empty).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
out="${1:-$here/generated}"
protoc="${PROTOC:-protoc}"
plugin="${GRPC_PLUGIN-$(command -v grpc_python_plugin || true)}"
mkdir -p "$out"
if [[ -n "$plugin" ]]; then
  $protoc -I "$here/../../protos" --python_out="$out" --grpc_out="$out" --plugin=protoc-gen-grpc="$plugin" sibyl/v1/emulator.proto
else
  $protoc -I "$here/../../protos" --python_out="$out" --grpc_python_out="$out" sibyl/v1/emulator.proto
fi
echo "$out"
