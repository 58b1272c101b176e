using ThermVerify.Tests.Docs;

namespace ThermVerify.Tests.Api;

/// <summary>docs/embedding.md shows the program in EmbeddingExample.cs and what it prints on a bundled example.</summary>
public class EmbeddingDocTests
{
    private static string Document => Repository.PathOf("docs", "embedding.md");

    [Fact]
    public void The_document_shows_the_program_that_is_compiled_here()
    {
        var source = File.ReadAllText(Repository.PathOf("tests", "ThermVerify.Tests", "Api", "EmbeddingExample.cs"));
        var begin = source.IndexOf("// example: begin", StringComparison.Ordinal);
        var end = source.IndexOf("// example: end", StringComparison.Ordinal);
        var lines = source[begin..end].Split('\n').Skip(1).SkipLast(1).Select(l => l.Length >= 4 ? l[4..] : l.TrimStart());
        DocBlocks.AssertCurrent(Document, "embedding-program", string.Join("\n", lines));
    }

    [Fact]
    public void The_document_shows_what_the_program_prints()
    {
        var output = new StringWriter();
        var folder = Directory.CreateTempSubdirectory("tv-embedding-");
        try
        {
            var json = Path.Combine(folder.FullName, "check.json");
            Assert.Equal(0, EmbeddingExample.Run(Path.Combine(Repository.Netlists, "oven-pt1000.toml"), json, output));
            Assert.StartsWith("{", File.ReadAllText(json));
        }
        finally
        {
            folder.Delete(recursive: true);
        }
        DocBlocks.AssertCurrent(Document, "embedding-output", output.ToString());
    }
}
