package service

import (
	"crypto/sha256"
	"encoding/base64"
)

// idBytes is how many bytes of the SHA-256 digest make an id: 16 bytes (128 bits), written as 22
// characters of unpadded base64url.
const idBytes = 16

var idEncoding = base64.RawURLEncoding

// ID returns the id a worksheet document is stored under: the first 128 bits of the SHA-256 digest of its
// exact bytes in unpadded base64url. The same bytes always give the same id; a document that differs in any
// byte (even white space) is a different document with a different id.
func ID(doc []byte) string {
	sum := sha256.Sum256(doc)
	return idEncoding.EncodeToString(sum[:idBytes])
}

// ValidID reports whether s has the form of an id made by ID.
func ValidID(s string) bool {
	if idEncoding.EncodedLen(idBytes) != len(s) {
		return false
	}
	b, err := idEncoding.Strict().DecodeString(s)
	return err == nil && len(b) == idBytes
}
