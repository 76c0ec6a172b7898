using OmicsScreen.Cli.Memory;

namespace OmicsScreen.Cli.Tests.Memory;

public class ByteSizeTests
{
    [Theory]
    [InlineData("1048576", 1048576L)]
    [InlineData("512M", 512L << 20)]
    [InlineData("8G", 8L << 30)]
    [InlineData("2.5G", 5L << 29)]
    [InlineData("1.5k", 1536L)]
    [InlineData("8GB", 8L << 30)]
    [InlineData("8GiB", 8L << 30)]
    [InlineData("1T", 1L << 40)]
    [InlineData("100B", 100L)]
    [InlineData(" 4g ", 4L << 30)]
    public void Sizes_are_read_in_powers_of_1024(string text, long bytes) =>
        // Units K, M, G, T as powers of 1024, as memory is counted (common practice).
        Assert.Equal(bytes, ByteSize.TryParse(text));

    [Theory]
    [InlineData("")]
    [InlineData("G")]
    [InlineData("12Q")]
    [InlineData("-1G")]
    [InlineData("1e9")]
    [InlineData("1,5G")]
    [InlineData("0")]
    [InlineData("1.2.3M")]
    [InlineData("99999999999T")]
    public void Anything_else_is_not_a_size(string text) => Assert.Null(ByteSize.TryParse(text));

    [Theory]
    [InlineData(900L, "900 bytes")]
    [InlineData(1536L, "1.5 KB")]
    [InlineData(1288490189L, "1.2 GB")]
    [InlineData(20L << 30, "20 GB")]
    [InlineData(850L << 20, "850 MB")]
    public void Sizes_are_written_with_two_significant_digits(long bytes, string text) => Assert.Equal(text, ByteSize.Format(bytes));
}
