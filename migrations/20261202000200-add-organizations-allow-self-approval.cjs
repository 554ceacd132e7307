'use strict';

// Separation of duties: by default whoever started a run cannot also approve it as the baseline.
// An owner of a small organisation, with nobody else to check, may allow it.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Organizations', 'allowSelfApproval', {
      type: Sequelize.BOOLEAN,
      allowNull: false,
      defaultValue: false,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Organizations', 'allowSelfApproval');
  },
};
