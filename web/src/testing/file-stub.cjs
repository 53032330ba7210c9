// Stands in for font and image files imported by modules under test.
module.exports = 'test-file-stub';
