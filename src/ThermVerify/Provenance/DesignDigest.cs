using System.Security.Cryptography;
using System.Text;

namespace ThermVerify.Provenance;

/// <summary>One file a design is made of, by its path relative to the design's folder, with the SHA-256 of its bytes (lower-case hex).</summary>
public sealed record SourceFile(string Name, string Sha256);

/// <summary>
/// What a design was read from: the design file first, then every file it read (an R–T table, an op-amp subcircuit
/// and the files that includes) in the order read, each with the SHA-256 of its bytes. <see cref="Sha256"/> names
/// them all at once so anyone can recompute it with standard tools: with no other file it is the design file's own
/// SHA-256 (what <c>sha256sum design.toml</c> prints); otherwise it is the SHA-256 of the lines <c>sha256sum</c> prints
/// for the files in that order, run in the design's folder (<c>sha256sum design.toml rt.csv | sha256sum</c>).
/// Two digests are equal when that hash is.
/// </summary>
public sealed record DesignDigest(IReadOnlyList<SourceFile> Files)
{
    public string Sha256 { get; } = Combine(Files);

    /// <summary>The SHA-256 of <paramref name="bytes"/> in lower-case hex.</summary>
    public static string Of(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    /// <summary>The digest of a design given as text rather than read from a file: of its UTF-8 bytes.</summary>
    public static DesignDigest OfText(string name, string text) => new([new SourceFile(name, Of(Encoding.UTF8.GetBytes(text)))]);

    /// <summary>"sha256 HASH (design.toml, rt.csv)", or why there is none.</summary>
    public static string Describe(DesignDigest? digest, bool shortHash = false) => digest is null
        ? "built in code, not read from a file"
        : $"sha256 {(shortHash ? digest.Sha256[..16] + "…" : digest.Sha256)} ({string.Join(", ", digest.Files.Select(f => f.Name))})";

    public bool Equals(DesignDigest? other) => other is not null && other.Sha256 == Sha256;

    public override int GetHashCode() => Sha256.GetHashCode(StringComparison.Ordinal);

    private static string Combine(IReadOnlyList<SourceFile> files)
    {
        if (files.Count == 0) throw new ArgumentException("A design digest names at least the design file.", nameof(files));
        return files.Count == 1 ? files[0].Sha256 : Of(Encoding.UTF8.GetBytes(string.Concat(files.Select(f => $"{f.Sha256}  {f.Name}\n"))));
    }
}
