using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Engine.Panels;
using Parquet;
using Parquet.Schema;

namespace OmicsScreen.Data.Tests.Columnar;

/// <summary>
/// Parquet and Arrow files written by other tools use double, integer and non-nullable columns;
/// each loads to the same cells as its text form would.
/// </summary>
public sealed class TypedColumnTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static PanelLoadOptions Options(string path) => new() { MatrixPath = path, OutcomeColumn = "group" };

    private async Task<string> WriteParquet(string name, double?[] nullableDoubles, double[] doubles)
    {
        var id = new DataField<string>("id");
        var group = new DataField<string>("group");
        var nullable = new DataField<double?>("nullable_double");
        var required = new DataField<double>("double");
        var integers = new DataField<long>("count");
        var path = _folder.File(name);
        await using var stream = File.Create(path);
        await using var writer = await ParquetWriter.CreateAsync(new ParquetSchema(id, group, nullable, required, integers), stream);
        using var rowGroup = writer.CreateRowGroup();
        await rowGroup.WriteAsync(id, ["s1", "s2", "s3"]);
        await rowGroup.WriteAsync(group, ["x", "y", "x"]);
        await rowGroup.WriteAsync<double>(nullable, nullableDoubles.AsMemory());
        await rowGroup.WriteAsync<double>(required, doubles.AsMemory());
        await rowGroup.WriteAsync<long>(integers, new long[] { 7, 8, 9 }.AsMemory());
        return path;
    }

    [Fact]
    public async Task Parquet_double_integer_and_required_columns_load_with_null_and_NaN_as_missing()
    {
        var path = await WriteParquet("typed.parquet", [null, 2.5, 1e-3], [0.1, double.NaN, -4]);
        var matrix = PanelLoader.Load(Options(path)).Panel.Matrix;

        Assert.Equal(["nullable_double", "double", "count"], matrix.FeatureNames);
        Assert.Equal(CellState.Missing, matrix.State(0, 0));
        Assert.Equal(2.5f, matrix.Value(0, 1));
        Assert.Equal(1e-3f, matrix.Value(0, 2));
        Assert.Equal(0.1f, matrix.Value(1, 0));
        Assert.Equal(CellState.Missing, matrix.State(1, 1));
        Assert.Equal([7f, 8f, 9f], matrix.Column(2).ToArray());
        Assert.False(matrix.HasUnmeasuredCells(2));
    }

    [Fact]
    public async Task Parquet_infinity_is_an_error_naming_the_row_and_column()
    {
        var path = await WriteParquet("inf.parquet", [1, 2, 3], [0.1, double.PositiveInfinity, -4]);
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));
        Assert.Contains("inf.parquet, row 2, column 'double'", error.Message);
        Assert.Contains("infinite value", error.Message);
    }

    [Fact]
    public void Arrow_double_and_integer_columns_load_and_a_double_beyond_float_range_is_an_error()
    {
        var schema = new Schema.Builder()
            .Field(f => f.Name("id").DataType(StringType.Default))
            .Field(f => f.Name("group").DataType(StringType.Default))
            .Field(f => f.Name("d").DataType(DoubleType.Default).Nullable(true))
            .Field(f => f.Name("n").DataType(Int32Type.Default))
            .Build();
        string Write(string name, double third)
        {
            var path = _folder.File(name);
            IArrowArray[] arrays =
            [
                new StringArray.Builder().Append("s1").Append("s2").Append("s3").Build(),
                new StringArray.Builder().Append("x").Append("y").Append("y").Build(),
                new DoubleArray.Builder().Append(1.25).AppendNull().Append(third).Build(),
                new Int32Array.Builder().Append(-1).Append(0).Append(1).Build(),
            ];
            using var stream = File.Create(path);
            using var writer = new ArrowFileWriter(stream, schema);
            writer.WriteRecordBatch(new RecordBatch(schema, arrays, 3));
            writer.WriteEnd();
            return path;
        }

        var matrix = PanelLoader.Load(Options(Write("typed.arrow", double.NaN))).Panel.Matrix;
        Assert.Equal(1.25f, matrix.Value(0, 0));
        Assert.Equal(CellState.Missing, matrix.State(0, 1));
        Assert.Equal(CellState.Missing, matrix.State(0, 2));
        Assert.Equal([-1f, 0f, 1f], matrix.Column(1).ToArray());

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(Write("big.arrow", 1e300))));
        Assert.Contains("big.arrow, row 3, column 'd'", error.Message);
        Assert.Contains("beyond the float32 range", error.Message);
    }

    [Fact]
    public async Task Parquet_sample_without_outcome_names_the_table_row()
    {
        var id = new DataField<string>("id");
        var group = new DataField<string>("group");
        var value = new DataField<float>("a");
        var path = _folder.File("nogroup.parquet");
        await using (var stream = File.Create(path))
        await using (var writer = await ParquetWriter.CreateAsync(new ParquetSchema(id, group, value), stream))
        using (var rowGroup = writer.CreateRowGroup())
        {
            await rowGroup.WriteAsync(id, ["s1", "s2"]);
            await rowGroup.WriteAsync(group, ["x", null!]);
            await rowGroup.WriteAsync<float>(value, new float[] { 1, 2 }.AsMemory());
        }
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));
        Assert.Contains("nogroup.parquet, row 2, column 'group'", error.Message);
        Assert.Contains("sample 's2' has no outcome value", error.Message);
    }
}
